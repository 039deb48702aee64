/**
 * The finding rules, one per finding code (a rule module per code in this folder, named after the code in kebab
 * case). The order of the entries is the order findings are listed in: state rules first, then wiring rules.
 */
import type { RuleRegistry } from '../rule.types';
import { breakIn } from './break-in';
import { intercomSoundsSeveral } from './intercom-sounds-several';
import { lineLitUnattended } from './line-lit-unattended';
import { lineOnControlLead } from './line-on-control-lead';
import { linesJoined } from './lines-joined';
import { privateLeadShared } from './private-lead-shared';
import { ringingOverJoinedLines } from './ringing-over-joined-lines';
import { setHearsSeveralLines } from './set-hears-several-lines';
import { setHearsUnselectedLine } from './set-hears-unselected-line';

export const RULES: RuleRegistry = {
  LINES_JOINED: linesJoined,
  SET_HEARS_SEVERAL_LINES: setHearsSeveralLines,
  SET_HEARS_UNSELECTED_LINE: setHearsUnselectedLine,
  BREAK_IN: breakIn,
  LINE_LIT_UNATTENDED: lineLitUnattended,
  INTERCOM_SOUNDS_SEVERAL: intercomSoundsSeveral,
  LINE_ON_CONTROL_LEAD: lineOnControlLead,
  RINGING_OVER_JOINED_LINES: ringingOverJoinedLines,
  PRIVATE_LEAD_SHARED: privateLeadShared,
};
