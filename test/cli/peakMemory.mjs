// Preloaded into the `curve` command by the bounded-memory tests (`node --import`): when the
// process exits it writes its peak resident set size, in kilobytes (getrusage's ru_maxrss), to the
// file named by TENORSCOPE_PEAK_FILE. The command itself runs unchanged, in the same process.
import { writeFileSync } from 'node:fs';

process.on('exit', () => {
  writeFileSync(process.env.TENORSCOPE_PEAK_FILE, `${process.resourceUsage().maxRSS}\n`);
});
