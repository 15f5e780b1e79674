// Loaded only into the soak's API process (`node --expose-gc --import ./scripts/lib/memory-probe.mjs`),
// never by product code. On each `{ probe: 'memory' }` message over the IPC channel it runs a full
// garbage collection and answers with process.memoryUsage(), so the soak reads what the process
// keeps, not where the collector's sawtooth happens to be.
process.on('message', (message) => {
  if (!message || message.probe !== 'memory') return;
  // Two passes: the first may only queue finalisers whose memory the second frees.
  globalThis.gc?.();
  globalThis.gc?.();
  process.send?.({ probe: 'memory', id: message.id, gc: typeof globalThis.gc === 'function', ...process.memoryUsage() });
});
// The IPC channel must not keep the process alive on its own after the server closes.
process.channel?.unref();
