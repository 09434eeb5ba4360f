/**
 * Loaded into a benchmarked server (with --expose-gc): SIGUSR2 runs a full garbage collection and
 * answers on stdout with the heap in use, so resident memory is read without the garbage of the moment.
 */
process.on('SIGUSR2', () => {
  (globalThis as unknown as { gc?: () => void }).gc?.();
  const { heapUsed, external, arrayBuffers } = process.memoryUsage();
  process.stdout.write(`collected heap=${heapUsed} external=${external} buffers=${arrayBuffers}\n`);
});
