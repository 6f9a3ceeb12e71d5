export declare const START_USAGE: string;
export declare function parseStartFlags(
  argv: string[],
): { demo: boolean | undefined; lan: boolean; error?: undefined } | { error: string };
export declare function decideDemo(inputs: {
  envDemoMode: string | undefined;
  flag: boolean | undefined;
  remembered: boolean | undefined;
  isTTY: boolean;
  production: boolean;
}):
  | { demo: boolean; source: 'env' | 'flag' | 'remembered' | 'default'; ask?: undefined }
  | { ask: true };
export declare function demoAnswer(typed: string | undefined): boolean | undefined;
export declare function readRememberedDemo(text: string | undefined): boolean | undefined;
