// Preloaded into a benchmarked child process (node --require): prints its peak resident memory on exit.
process.on('exit', () => {
  process.stderr.write(`\nbench-max-rss-kib ${process.resourceUsage().maxRSS}\n`);
});
