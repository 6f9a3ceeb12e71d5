export declare function pgMemorySettings(totalBytes: number): {
  sharedBuffers: string;
  maxConnections: number;
};
