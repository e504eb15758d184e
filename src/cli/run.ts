/**
 * The command-line shell: dispatch, help, and the one rule for errors — a ValidationError is one line on stderr
 * and exit code 2; a closed stdout pipe stops quietly with status 141; anything else is an internal error, exit 1, with the trace only when LACUNA_DEBUG is set.
 */
import { ValidationError, invalid } from '../validate/invalid.ts';
import { commandHelp } from './args.ts';
import { bandsCommand } from './commands/bands.ts';
import { bondingCommand } from './commands/bonding.ts';
import { calibrateCommand } from './commands/calibrate.ts';
import { benchCommand } from './commands/bench.ts';
import { dosCommand } from './commands/dos.ts';
import { enumerateCommand } from './commands/enumerate.ts';
import { expandCommand } from './commands/expand.ts';
import { exportCommand } from './commands/export.ts';
import { fillCommand } from './commands/fill.ts';
import { fitCommand } from './commands/fit.ts';
import { geometryCommand } from './commands/geometry.ts';
import { metalsCommand } from './commands/metals.ts';
import { plotCommand } from './commands/plot.ts';
import { presetsCommand } from './commands/presets.ts';
import { rankCommand } from './commands/rank.ts';
import { scanCommand } from './commands/scan.ts';
import { transferCommand } from './commands/transfer.ts';
import { stmCommand } from './commands/stm.ts';
import { matchCommand } from './commands/match.ts';
import { unfoldCommand } from './commands/unfold.ts';
import { PIPE_CLOSED_STATUS, PipeClosed, type CliIo, type Command } from './io.ts';

export const COMMANDS: readonly Command[] = [
  enumerateCommand, geometryCommand, bandsCommand, fillCommand, scanCommand, dosCommand, bondingCommand, rankCommand, exportCommand,
  unfoldCommand, plotCommand, transferCommand, fitCommand, metalsCommand, stmCommand, matchCommand, expandCommand, presetsCommand, benchCommand,
  calibrateCommand,
];

function overview(): string {
  const lines = ['lacuna — vacancy patterns, bands and electron counting for boron sheets', '', 'usage: lacuna <command> [options]   (lacuna help <command> for its options)', ''];
  for (const command of COMMANDS) lines.push(`  ${command.spec.name.padEnd(10)} ${command.spec.summary}`);
  return `${lines.join('\n')}\n`;
}

export async function runCli(argv: readonly string[], io: CliIo, debug = false): Promise<number> {
  try {
    const [name, ...rest] = argv;
    if (name === undefined || name === 'help' || name === '--help' || name === '-h') {
      const topic = rest[0];
      if (name === 'help' && topic !== undefined) {
        const command = COMMANDS.find((c) => c.spec.name === topic);
        if (!command) invalid('command', topic, `unknown; commands: ${COMMANDS.map((c) => c.spec.name).join(', ')}`);
        io.out(`${commandHelp(command.spec)}\n`);
      } else {
        io.out(overview());
      }
      return 0;
    }
    const command = COMMANDS.find((c) => c.spec.name === name);
    if (!command) invalid('command', name, `unknown; commands: ${COMMANDS.map((c) => c.spec.name).join(', ')}`);
    if (rest.includes('--help')) {
      io.out(`${commandHelp(command.spec)}\n`);
      return 0;
    }
    return await command.run(rest, io);
  } catch (error) {
    if (error instanceof PipeClosed) {
      // The reader stopped early: normal, say nothing (but clear a progress line a terminal may show).
      if (io.err.isTTY) io.err.write('\r\x1b[K');
      return PIPE_CLOSED_STATUS;
    }
    if (error instanceof ValidationError) {
      io.err.write(`${error.message}\n`);
      return 2;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.err.write(`lacuna: internal error: ${message.split('\n')[0]} (please report it; set LACUNA_DEBUG=1 for the trace)\n`);
    if (debug && error instanceof Error && error.stack) io.err.write(`${error.stack}\n`);
    return 1;
  }
}
