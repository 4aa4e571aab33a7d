// Preloaded by bench/bench.ts into a `mixwise run` child (node --import): prints the process's
// peak resident memory (worker threads included) on stderr as it exits.
process.on('exit', () => process.stderr.write(`peak-rss-kb ${process.resourceUsage().maxRSS}\n`));
