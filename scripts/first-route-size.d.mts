export function firstRouteJs(distDir: string): {
  files: { file: string; gzipBytes: number }[];
  gzipBytes: number;
};
