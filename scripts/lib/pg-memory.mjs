// The private cluster's memory settings, from how much memory the machine has.
// Plain Node with no dependencies.

const MB = 1024 * 1024;

/**
 * shared_buffers: a sixteenth of the memory as a power of two, from 32 MB up to 512 MB. The
 * PostgreSQL manual (Server Configuration, 20.4.1 Memory) suggests a quarter on a dedicated
 * server; here the database shares the machine with the app, its build and often a browser.
 * 512 MB keeps a 20,000-animal collection's working set in memory (the bench's largest).
 * max_connections: 200 from 4 GB (the test suite opens many pools at once), fewer below,
 * where each backend's few megabytes matter; `npm start` needs about 30 (server pool 20,
 * job queue 4, migrations 4).
 */
export function pgMemorySettings(totalBytes) {
  const totalMb = Math.max(1, Math.floor(totalBytes / MB));
  let buffersMb = 32;
  while (buffersMb * 2 <= Math.min(512, totalMb / 16)) buffersMb *= 2;
  const maxConnections = totalMb >= 4096 ? 200 : totalMb >= 2048 ? 100 : 50;
  return { sharedBuffers: `${buffersMb}MB`, maxConnections };
}
