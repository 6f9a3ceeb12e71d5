export declare const CHROMIUM_NAMES: string[];
export declare const CHROMIUM_FALLBACK: string;
export declare function lookUpChromium(inputs: {
  envPath: string | undefined;
  pathVar: string | undefined;
  isExecutable: (file: string) => boolean;
}): { path: string; error?: undefined } | { path?: undefined; error: string };
export declare function findChromium(env?: NodeJS.ProcessEnv): string | null;
export declare function chromiumPath(env?: NodeJS.ProcessEnv): string;
