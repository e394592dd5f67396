/**
 * Median wall time (ms) of `runs` calls of `task` after `warmup` untimed calls; the warm-up lets
 * the JIT reach its optimised code so that both sides of a ratio are measured alike.
 */
export function medianTime(task: () => unknown, runs = 50, warmup = 50): number {
  for (let i = 0; i < warmup; i++) task();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    task();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)] as number;
}

/**
 * Median CPU time (ms, user + system of this process, `process.cpuUsage`) of `runs` calls of
 * `task` after `warmup` untimed calls. On a shared machine a call's wall time also counts the
 * time other processes hold the cores; its CPU time counts only its own work, so ratios of CPU
 * times measured in one run stay comparable when the machine is busy.
 */
export function medianCpuTime(task: () => unknown, runs = 50, warmup = 50): number {
  for (let i = 0; i < warmup; i++) task();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = process.cpuUsage();
    task();
    const used = process.cpuUsage(start);
    times.push((used.user + used.system) / 1000);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)] as number;
}

/** Prints a markdown table of label/value rows under a heading. */
export function printTable(heading: string, rows: [string, string][]): void {
  console.log(`\n### ${heading}\n`);
  console.log('| measure | value |');
  console.log('| --- | --- |');
  for (const [label, value] of rows) console.log(`| ${label} | ${value} |`);
}
