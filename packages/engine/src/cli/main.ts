import { nominalCommand } from './nominalCommand.js';
import { runCommand } from './runCommand.js';

const USAGE = `usage: sigmatail <command> FILE.json [options]
  nominal FILE.json                                   nominal operating point, small-signal, frequency and large-signal results
  run FILE.json --samples N --seed S [--plan random|lhs|sobol] [--large-signal] [--large-signal-samples M]   Monte Carlo run`;

/** CLI entry: returns the process exit code (0 ok, 2 bad input). Output is one JSON object on stdout. */
export async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  try {
    if (command === 'nominal') return await nominalCommand(rest);
    if (command === 'run') return await runCommand(rest);
    process.stderr.write(`${USAGE}\n`);
    return 2;
  } catch (err) {
    process.stderr.write(`sigmatail: ${err instanceof Error ? err.message : String(err)}\n`);
    return 2;
  }
}
