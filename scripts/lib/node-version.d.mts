export declare function minimumFromEngines(range: string | undefined): number[] | null;
export declare function checkNodeVersion(
  version: string,
  minimum: number[],
): { ok: true } | { ok: false; message: string };
