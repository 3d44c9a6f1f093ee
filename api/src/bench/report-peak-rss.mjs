// Loaded with --import into a measured program: at exit, prints its peak resident set size on stderr.
process.on('exit', () => process.stderr.write(`\npeak-rss-kb ${process.resourceUsage().maxRSS}\n`));
