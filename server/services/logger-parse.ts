import type { ApplianceStyle } from '../../shared/domain';
import { LoggerFileError, parseLoggerCsv, type LoggerSeries } from '../detection/logger-csv';
import { badRequest } from '../errors';

/** Without a chosen style the columns decide, as the `analyze` command does. */
export function defaultStyleFor(series: LoggerSeries): ApplianceStyle {
  if (series.hasFreshFood && series.hasFreezer) return 'top-freezer';
  return series.hasFreshFood ? 'fresh-food-only' : 'upright-freezer';
}

/** The parser's message reaches the manager as a 400: it names what is wrong with the file. */
export function parseOrReject(text: string): ReturnType<typeof parseLoggerCsv> {
  try {
    return parseLoggerCsv(text);
  } catch (error) {
    if (error instanceof LoggerFileError) throw badRequest(`the logger file cannot be read: ${error.message}`);
    throw error;
  }
}
