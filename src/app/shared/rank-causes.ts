import { CAUSES, type CauseInfo } from '../../../shared/causes';
import type { CauseCode } from '../../../shared/domain';

/** A probable cause as the diagnosis cards list it: most likely first, confidence as a whole percent. */
export interface RankedCause {
  code: CauseCode;
  confidence: number;
  percent: number;
  info: CauseInfo;
}

export function rankCauses(causes: readonly { code: CauseCode; confidence: number }[]): RankedCause[] {
  return [...causes]
    .sort((a, b) => b.confidence - a.confidence)
    .map((cause) => ({ code: cause.code, confidence: cause.confidence, percent: Math.round(cause.confidence * 100), info: CAUSES[cause.code] }));
}
