// Preloaded by bench/bench.ts into a `mixwise run` child (node --import): prints the process's
// peak resident memory and its CPU time (worker threads included) on stderr as it exits.
process.on('exit', () => {
  const cpu = process.cpuUsage();
  process.stderr.write(`peak-rss-kb ${process.resourceUsage().maxRSS}\ncpu-ms ${Math.round((cpu.user + cpu.system) / 1000)}\n`);
});
