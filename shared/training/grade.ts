/**
 * Checking a puzzle and grading a trainee's answer, both with the engine's public API only:
 * symptoms are what people at the sets see in the probe states; a repair passes when the sweep finds no fault,
 * the required functions still work and every probe looks as it does on the healthy plan.
 */
import {
  checkRequired,
  evaluate,
  leadTable,
  pairColour,
  sweep,
  type Hop,
  type Plan,
} from '../engine/index';
import {
  applyRepair,
  describeFault,
  describeRepairStep,
  faultLocation,
  plantFault,
  plantFaults,
} from './faults';
import type { Diagnosis, PlantedFault, PuzzleSpec, RepairStep } from './puzzle.schema';
import { differingProbes, probeState, probes, type Probe } from './sightings';
import equal from 'fast-deep-equal';

export interface RepairAssessment {
  /** Per planted fault, in order: are its own symptoms gone? */
  cleared: boolean[];
  /** Findings of severity fault the sweep still reports. */
  findingsLeft: number;
  requiredFailures: number;
  /** Probe states that still look different from the healthy plan. */
  differing: string[];
  passed: boolean;
}

interface Prepared {
  spec: PuzzleSpec;
  faulty: Plan;
  probes: Probe[];
  /** Per fault: the probes in which that fault alone shows. */
  faultProbes: string[][];
}

export type PrepareResult = { ok: true; prepared: Prepared } | { ok: false; problem: string };

export function preparePuzzle(spec: PuzzleSpec): PrepareResult {
  const planted = plantFaults(spec.plan, spec.faults);
  if (!planted.ok) return { ok: false, problem: planted.problem };
  const list = probes(spec.plan);
  const faultProbes = spec.faults.map((fault) => {
    const alone = plantFault(spec.plan, fault);
    return alone.ok ? differingProbes(spec.plan, alone.plan, list) : [];
  });
  return { ok: true, prepared: { spec, faulty: planted.plan, probes: list, faultProbes } };
}

export function assessRepair(prepared: Prepared, repaired: Plan): RepairAssessment {
  const differing = differingProbes(prepared.spec.plan, repaired, prepared.probes);
  const still = new Set(differing);
  const findingsLeft = sweep(repaired).findings.filter((f) => f.finding.severity === 'fault').length;
  const requiredFailures = checkRequired(repaired).length;
  const clean = differing.length === 0 && findingsLeft === 0;
  const cleared = prepared.faultProbes.map((names) =>
    names.length ? names.every((n) => !still.has(n)) : clean,
  );
  return {
    cleared,
    findingsLeft,
    requiredFailures,
    differing,
    passed: clean && requiredFailures === 0 && cleared.every(Boolean),
  };
}

export interface PuzzleCheck {
  ok: boolean;
  problems: string[];
  /** Probe states in which the faulty plan looks different from the healthy one. */
  symptoms: string[];
}

/** The index of the first repair step that a later one repeats, or null. A repeated step is a slip in the data. */
function repeatedStep(repair: readonly unknown[]): number | null {
  for (const [i, step] of repair.entries()) {
    const first = repair.findIndex((earlier) => equal(earlier, step));
    if (first < i) return first;
  }
  return null;
}

/** Everything a shipped or saved puzzle must satisfy. */
export function checkPuzzle(spec: PuzzleSpec): PuzzleCheck {
  const problems: string[] = [];
  const healthyFindings = sweep(spec.plan).findings.filter((f) => f.finding.severity === 'fault');
  if (healthyFindings.length)
    problems.push(`The healthy plan already has findings: ${healthyFindings[0].finding.message}`);
  const healthyRequired = checkRequired(spec.plan);
  if (healthyRequired.length) problems.push(`The healthy plan fails a required function: ${healthyRequired[0].message}`);
  const prepared = preparePuzzle(spec);
  if (!prepared.ok) return { ok: false, problems: [...problems, prepared.problem], symptoms: [] };
  const { faulty, faultProbes } = prepared.prepared;
  const symptoms = differingProbes(spec.plan, faulty, prepared.prepared.probes);
  if (!symptoms.length) problems.push('The planted faults show no symptom at the sets in any probe state');
  faultProbes.forEach((names, i) => {
    if (!names.length) problems.push(`Fault ${i + 1} on its own shows no symptom at the sets`);
  });
  const twice = repeatedStep(spec.repair);
  if (twice !== null) problems.push(`The intended repair lists step ${twice + 1} twice`);
  const repaired = applyRepair(faulty, spec.repair);
  if (!repaired.ok) problems.push(`The intended repair does not apply: ${repaired.problem}`);
  else {
    const outcome = assessRepair(prepared.prepared, repaired.plan);
    if (outcome.findingsLeft) problems.push(`After the intended repair the sweep still finds ${outcome.findingsLeft} fault(s)`);
    if (outcome.requiredFailures) problems.push('The intended repair breaks a required function');
    if (outcome.differing.length)
      problems.push(`After the intended repair these states still differ: ${outcome.differing.join(', ')}`);
    outcome.cleared.forEach((ok, i) => {
      if (!ok) problems.push(`The intended repair does not clear fault ${i + 1}`);
    });
  }
  return { ok: problems.length === 0, problems, symptoms };
}

export interface SubmissionContext {
  /** 1 for the first submission. */
  attemptNumber: number;
  statesTried: number;
  elapsedMs: number;
}

export interface ScoreLine {
  item: 'cleared' | 'diagnosis' | 'required' | 'economy' | 'exploration' | 'attempts' | 'time';
  label: string;
  points: number;
  max: number;
  note: string;
}

export interface GradeResult {
  passed: boolean;
  score: number;
  maxScore: number;
  breakdown: ScoreLine[];
  faultCount: number;
  faultsCleared: number;
  diagnosesRight: number;
  requiredKept: boolean;
  unnecessaryChanges: number;
  findingsLeft: number;
  statesStillDifferent: number;
}

export type GradeOutcome = { ok: true; result: GradeResult } | { ok: false; problem: string };

function matches(plan: Plan, fault: PlantedFault, d: Diagnosis): boolean {
  const where = faultLocation(plan, fault);
  return d.kind === fault.kind && d.part === where.part && (where.pair === null || d.pair === where.pair);
}

function rank(a: RepairAssessment): number[] {
  return [a.cleared.filter(Boolean).length, -a.differing.length, -a.findingsLeft, -a.requiredFailures];
}

const atLeastAsGood = (a: number[], b: number[]) => {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] > b[i];
  return true;
};

/** Steps the answer could do without: taking one out leaves the outcome at least as good. */
function unnecessarySteps(prepared: Prepared, steps: RepairStep[], outcome: RepairAssessment): number {
  const full = rank(outcome);
  let count = 0;
  for (let i = 0; i < steps.length; i++) {
    const without = applyRepair(prepared.faulty, steps.filter((_, j) => j !== i));
    if (without.ok && atLeastAsGood(rank(assessRepair(prepared, without.plan)), full)) count += 1;
  }
  return count;
}

export function gradeSubmission(
  spec: PuzzleSpec,
  submission: { diagnoses: Diagnosis[]; repair: RepairStep[] },
  context: SubmissionContext,
): GradeOutcome {
  const prep = preparePuzzle(spec);
  if (!prep.ok) return { ok: false, problem: prep.problem };
  const prepared = prep.prepared;
  const repaired = applyRepair(prepared.faulty, submission.repair);
  if (!repaired.ok) return { ok: false, problem: repaired.problem };
  const outcome = assessRepair(prepared, repaired.plan);
  const r = spec.rubric;
  const faultCount = spec.faults.length;
  const faultsCleared = outcome.cleared.filter(Boolean).length;

  const unmatched = [...submission.diagnoses];
  let diagnosesRight = 0;
  for (const fault of spec.faults) {
    const i = unmatched.findIndex((d) => matches(spec.plan, fault, d));
    if (i >= 0) {
      diagnosesRight += 1;
      unmatched.splice(i, 1);
    }
  }
  const unnecessary = unnecessarySteps(prepared, submission.repair, outcome);
  const requiredKept = outcome.requiredFailures === 0;
  const minutes = context.elapsedMs / 60_000;
  const share = (n: number, of: number, points: number) => Math.round((points * n) / of);

  const breakdown: ScoreLine[] = [
    {
      item: 'cleared',
      label: 'Faults cleared',
      points: share(faultsCleared, faultCount, r.cleared),
      max: r.cleared,
      note: `${faultsCleared} of ${faultCount} cleared${outcome.findingsLeft ? `; the sweep still finds ${outcome.findingsLeft} fault(s)` : ''}`,
    },
    {
      item: 'diagnosis',
      label: 'Diagnosis',
      points: Math.max(0, share(diagnosesRight, faultCount, r.diagnosis) - share(unmatched.length, faultCount, r.diagnosis) / 2),
      max: r.diagnosis,
      note: `${diagnosesRight} of ${faultCount} named correctly${unmatched.length ? `, ${unmatched.length} wrong` : ''}`,
    },
    {
      item: 'required',
      label: 'Required functions kept',
      points: requiredKept && outcome.differing.length === 0 ? r.required : 0,
      max: r.required,
      note: requiredKept
        ? outcome.differing.length
          ? `${outcome.differing.length} state(s) still behave differently from the working installation`
          : 'Everything that must work still works'
        : 'A required function no longer works',
    },
    {
      item: 'economy',
      label: 'No unnecessary changes',
      points: Math.max(0, r.economy - unnecessary * r.unnecessaryChangePenalty),
      max: r.economy,
      note: unnecessary ? `${unnecessary} change(s) were not needed` : 'Every change was needed',
    },
    {
      item: 'exploration',
      label: 'States tried',
      points: share(Math.min(context.statesTried, r.minStates), r.minStates, r.exploration),
      max: r.exploration,
      note: `${context.statesTried} state(s) tried before answering`,
    },
    {
      item: 'attempts',
      label: 'Attempts',
      points: -(context.attemptNumber - 1) * r.extraAttemptPenalty,
      max: 0,
      note: `Attempt ${context.attemptNumber} of ${spec.attemptLimit}`,
    },
    {
      item: 'time',
      label: 'Time',
      points: minutes > r.targetMinutes ? -r.latePenalty : 0,
      max: 0,
      note: `${Math.ceil(minutes)} min (target ${r.targetMinutes} min)`,
    },
  ];
  const maxScore = r.cleared + r.diagnosis + r.required + r.economy + r.exploration;
  const total = breakdown.reduce((sum, line) => sum + line.points, 0);
  return {
    ok: true,
    result: {
      passed: outcome.passed,
      score: Math.max(0, Math.min(maxScore, Math.round(total))),
      maxScore,
      breakdown,
      faultCount,
      faultsCleared,
      diagnosesRight,
      requiredKept,
      unnecessaryChanges: unnecessary,
      findingsLeft: outcome.findingsLeft,
      statesStillDifferent: outcome.differing.length,
    },
  };
}

export interface Explanation {
  text: string;
  faults: string[];
  repair: string[];
  paths: { title: string; hops: Hop[] }[];
}

/** The conductor path of a fault: a finding's path where the engine reports one, else the leads at the spot. */
function faultPath(prepared: Prepared, index: number): Hop[] {
  const { spec, faulty, probes: list, faultProbes } = prepared;
  for (const name of faultProbes[index]) {
    const probe = list.find((p) => p.name === name);
    const state = probe ? probeState(faulty, probe) : null;
    const finding = state ? evaluate(faulty, state).findings.find((f) => f.path.length) : undefined;
    if (finding) return finding.path;
  }
  const where = faultLocation(spec.plan, spec.faults[index]);
  if (where.pair === null) return [];
  const colours = pairColour(where.pair);
  if (where.part === 'ksu') {
    return [{ part: spec.plan.ksu.id, partName: spec.plan.ksu.name, pair: where.pair, colour: colours.name, text: `${spec.plan.ksu.name}, cross-connect pair ${where.pair} (${colours.name})` }];
  }
  const row = leadTable(spec.plan, where.part).find((l) => l.pair === where.pair);
  const name = [...spec.plan.sets, ...spec.plan.addOns].find((p) => p.id === where.part)?.name ?? where.part;
  return (['tip', 'ring'] as const).map((conductor) => {
    const designation = (conductor === 'tip' ? row?.designationTip : row?.designationRing) ?? undefined;
    const colour = conductor === 'tip' ? colours.tip : colours.ring;
    return {
      part: where.part,
      partName: name,
      pair: where.pair!,
      conductor,
      colour,
      ...(designation ? { designation } : {}),
      text: `${name}, pair ${where.pair} ${conductor} (${colour})${designation ? `: ${designation}` : ''}`,
    };
  });
}

export function explainPuzzle(spec: PuzzleSpec): Explanation {
  const prep = preparePuzzle(spec);
  const faults = spec.faults.map((f) => describeFault(spec.plan, f));
  const repair = spec.repair.map((s) => describeRepairStep(spec.plan, s));
  const paths = prep.ok ? faults.map((title, i) => ({ title, hops: faultPath(prep.prepared, i) })) : [];
  return { text: spec.explanation, faults, repair, paths };
}
