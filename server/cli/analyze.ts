/**
 * Analyses a logger file with the detection engine:
 *   npm run --silent analyze -- FILE.csv [--style top-freezer]
 * Prints one JSON document on standard output (DESIGN.md, "Logger files"); for a file it
 * cannot read it prints one line on standard error and exits non-zero.
 */
import { readFileSync } from 'node:fs';
import { APPLIANCE_STYLES, type ApplianceStyle } from '../../shared/domain';
import { analyzeSeries } from '../detection/analyze';
import { LoggerFileError, parseLoggerCsv, type LoggerSeries } from '../detection/logger-csv';
import { loggerReportJson } from '../detection/logger-report';

const USAGE = 'usage: analyze FILE.csv [--style top-freezer|bottom-freezer|side-by-side|fresh-food-only|upright-freezer|chest-freezer]';

class UsageError extends Error {}

interface Options {
  file: string;
  style: ApplianceStyle | null;
}

function parseArgs(args: string[]): Options {
  let file: string | null = null;
  let style: ApplianceStyle | null = null;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--style' || arg.startsWith('--style=')) {
      const value = arg.includes('=') ? arg.slice('--style='.length) : args[++i];
      if (!APPLIANCE_STYLES.includes(value as ApplianceStyle)) throw new UsageError(`unknown style "${value ?? ''}"; ${USAGE}`);
      style = value as ApplianceStyle;
    } else if (arg.startsWith('-')) {
      throw new UsageError(`unknown option ${arg}; ${USAGE}`);
    } else if (file === null) {
      file = arg;
    } else {
      throw new UsageError(`one file at a time; ${USAGE}`);
    }
  }
  if (file === null) throw new UsageError(USAGE);
  return { file, style };
}

/** Without --style, the columns decide: both probes a refrigerator-freezer, one probe its own kind. */
function styleFor(series: LoggerSeries, chosen: ApplianceStyle | null): ApplianceStyle {
  if (chosen) return chosen;
  if (series.hasFreshFood && series.hasFreezer) return 'top-freezer';
  return series.hasFreshFood ? 'fresh-food-only' : 'upright-freezer';
}

function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new LoggerFileError(code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a directory' : `cannot read it (${code ?? 'unknown error'})`);
  }
}

function main(args: string[]): number {
  let options: Options;
  try {
    options = parseArgs(args);
  } catch (error) {
    process.stderr.write(`analyze: ${(error as Error).message}\n`);
    return 2;
  }
  try {
    const parsed = parseLoggerCsv(readText(options.file));
    const result = analyzeSeries(parsed.series, styleFor(parsed.series, options.style));
    process.stdout.write(`${JSON.stringify(loggerReportJson(result, parsed.report))}\n`);
    return 0;
  } catch (error) {
    if (!(error instanceof LoggerFileError)) throw error;
    process.stderr.write(`analyze: ${options.file}: ${error.message}\n`);
    return 1;
  }
}

process.exitCode = main(process.argv.slice(2));
