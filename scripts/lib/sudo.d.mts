export type InstallDecision = 'direct' | 'sudo' | 'ask' | 'print';
export declare function installDecision(facts: {
  isRoot: boolean;
  hasSudo: boolean;
  sudoNeedsPassword: boolean;
  isTTY: boolean;
  answer?: string;
}): InstallDecision;
export declare function aptCommandLine(packages: string[]): string;
