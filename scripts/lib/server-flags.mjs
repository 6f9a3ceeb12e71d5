// How node runs the bundled server, for `npm start` and the tests that start real processes.
// The heap limit keeps a busy process near its working set (P7: ~180 MB resident instead of
// ~280 MB, with no loss of throughput); the round caches are bounded to fit well within it.
export const SERVER_NODE_FLAGS = ['--enable-source-maps', '--max-old-space-size=160'];
