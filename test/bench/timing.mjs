// Small timing helper shared by the benchmarks: runs `fn` repeatedly for at least `minMs`
// milliseconds after a warm-up and returns the mean time per call in milliseconds.
export function timeIt(fn, { minMs = 1000, warmup = 3 } = {}) {
  for (let i = 0; i < warmup; i++) fn();
  let calls = 0;
  const start = performance.now();
  let now = start;
  while (now - start < minMs) {
    fn();
    calls++;
    now = performance.now();
  }
  return (now - start) / calls;
}
