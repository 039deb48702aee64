/**
 * Plan validation: the zod schema, then the cross-references a schema cannot see (templates, parts, ports,
 * stations, lines). Every issue carries the exact path of the offending value, e.g. "cables[0].to.port".
 */
import { zodIssues, type Issue } from '../document/issues';
import { getTemplate } from '../templates/part-templates';
import type { PartTemplate } from '../templates/template.types';
import { PlanSchema, type Plan, type PortRef, type WiringFault } from '../document/plan.schema';

export type PlanIssue = Issue;

export type ValidatePlanResult = { ok: true; plan: Plan } | { ok: false; issues: PlanIssue[] };

export interface PortInfo {
  part: string;
  partName: string;
  kind: 'set' | 'add-on' | 'adapter' | 'ksu';
  port: string;
  gender: 'plug' | 'jack';
}

/** Every part id of the plan with its ports (KSU station ports are jacks named port-1 …). */
export function portsOf(
  plan: Plan,
): Map<string, { name: string; kind: PortInfo['kind']; ports: Map<string, PortInfo> }> {
  const out = new Map<string, { name: string; kind: PortInfo['kind']; ports: Map<string, PortInfo> }>();
  const add = (
    id: string,
    name: string,
    kind: PortInfo['kind'],
    ports: { name: string; gender: 'plug' | 'jack' }[],
  ) => {
    if (out.has(id)) return;
    out.set(id, {
      name,
      kind,
      ports: new Map(
        ports.map((p) => [p.name, { part: id, partName: name, kind, port: p.name, gender: p.gender }]),
      ),
    });
  };
  add(
    plan.ksu.id,
    plan.ksu.name,
    'ksu',
    Array.from({ length: plan.ksu.ports }, (_, i) => ({ name: `port-${i + 1}`, gender: 'jack' as const })),
  );
  const tplPorts = (tpl: PartTemplate | undefined, kind: PartTemplate['kind']) =>
    tpl?.kind === kind ? tpl.ports : [];
  for (const s of plan.sets) add(s.id, s.name, 'set', tplPorts(getTemplate(s.template), 'set'));
  for (const a of plan.addOns) add(a.id, a.name, 'add-on', tplPorts(getTemplate(a.template), 'add-on'));
  for (const a of plan.adapters) add(a.id, a.name, 'adapter', tplPorts(getTemplate(a.template), 'adapter'));
  return out;
}

const KIND_WORD: Record<PartTemplate['kind'], string> = {
  set: 'key set',
  'add-on': 'add-on',
  adapter: 'adapter',
  ksu: 'KSU',
};

const withArticle = (word: string) => (/^[aeiou]/i.test(word) ? `an ${word}` : `a ${word}`);

export function validatePlan(input: unknown): ValidatePlanResult {
  const parsed = PlanSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
  const plan = parsed.data;
  const issues = crossReferenceIssues(plan);
  return issues.length ? { ok: false, issues } : { ok: true, plan };
}

export function crossReferenceIssues(plan: Plan): PlanIssue[] {
  const issues: PlanIssue[] = [];
  const issue = (path: string, message: string) => issues.push({ path, message });

  // Ids are unique across all parts.
  const ids = new Map<string, string>([[plan.ksu.id, 'ksu.id']]);
  const checkId = (id: string, path: string) => {
    const first = ids.get(id);
    if (first) issue(path, `Id "${id}" is already used (${first})`);
    else ids.set(id, path);
  };
  plan.sets.forEach((s, i) => checkId(s.id, `sets[${i}].id`));
  plan.addOns.forEach((a, i) => checkId(a.id, `addOns[${i}].id`));
  plan.adapters.forEach((a, i) => checkId(a.id, `adapters[${i}].id`));
  const cableIds = new Map<string, number>();
  plan.cables.forEach((c, i) => {
    if (cableIds.has(c.id))
      issue(`cables[${i}].id`, `Cable id "${c.id}" is already used (cables[${cableIds.get(c.id)}])`);
    else cableIds.set(c.id, i);
  });

  // KSU lines, stations and cross-connect.
  const ksu = plan.ksu;
  const lineNumbers = new Set<number>();
  ksu.lines.forEach((l, i) => {
    if (lineNumbers.has(l.number)) issue(`ksu.lines[${i}].number`, `Line ${l.number} is listed twice`);
    lineNumbers.add(l.number);
    if (l.number > ksu.lines.length) {
      issue(
        `ksu.lines[${i}].number`,
        `Line ${l.number} is beyond the KSU's ${ksu.lines.length} lines; number lines 1 to ${ksu.lines.length}`,
      );
    }
  });
  const dirNumbers = new Map<string, number>();
  ksu.lines.forEach((l, i) => {
    if (dirNumbers.has(l.directoryNumber)) {
      issue(
        `ksu.lines[${i}].directoryNumber`,
        `Directory number ${l.directoryNumber} is already line ${dirNumbers.get(l.directoryNumber)}'s`,
      );
    } else dirNumbers.set(l.directoryNumber, l.number);
  });
  const stationIds = new Set<string>();
  const stationCodes = new Set<string>();
  ksu.stations.forEach((s, i) => {
    if (stationIds.has(s.id)) issue(`ksu.stations[${i}].id`, `Station id "${s.id}" is listed twice`);
    if (stationCodes.has(s.code))
      issue(`ksu.stations[${i}].code`, `Intercom code ${s.code} is used by two stations`);
    stationIds.add(s.id);
    stationCodes.add(s.code);
  });
  const ccSeen = new Map<string, number>();
  (ksu.crossConnect ?? []).forEach((cc, i) => {
    const path = `ksu.crossConnect[${i}]`;
    if (cc.port > ksu.ports)
      issue(`${path}.port`, `The KSU has ${ksu.ports} station ports; there is no port ${cc.port}`);
    if (cc.lead.kind === 'buzzer') {
      if (!stationIds.has(cc.lead.station))
        issue(`${path}.lead.station`, `No intercom station "${cc.lead.station}" on the KSU`);
    } else if (!lineNumbers.has(cc.lead.line)) {
      issue(`${path}.lead.line`, `Line ${cc.lead.line} is beyond the KSU's ${ksu.lines.length} lines`);
    }
    const key = `${cc.port}:${cc.pair}:${JSON.stringify(cc.lead)}`;
    if (ccSeen.has(key)) issue(path, `Same cross-connect as ksu.crossConnect[${ccSeen.get(key)}]`);
    else ccSeen.set(key, i);
  });

  // Templates of parts.
  const checkTemplate = (id: string, kind: PartTemplate['kind'], path: string): PartTemplate | undefined => {
    const tpl = getTemplate(id);
    if (!tpl) issue(path, `Unknown ${KIND_WORD[kind]} template "${id}"`);
    else if (tpl.kind !== kind)
      issue(
        path,
        `"${id}" is ${withArticle(KIND_WORD[tpl.kind])} template, not ${withArticle(KIND_WORD[kind])} one`,
      );
    else return tpl;
    return undefined;
  };
  const setIds = new Set(plan.sets.map((s) => s.id));
  plan.sets.forEach((s, i) => {
    const tpl = checkTemplate(s.template, 'set', `sets[${i}].template`);
    if (s.station !== undefined && !stationIds.has(s.station)) {
      issue(`sets[${i}].station`, `No intercom station "${s.station}" on the KSU`);
    }
    s.ringerLines.forEach((line, j) => {
      if (!lineNumbers.has(line))
        issue(`sets[${i}].ringerLines[${j}]`, `Line ${line} is beyond the KSU's ${ksu.lines.length} lines`);
      else if (tpl && !tpl.ringerStraps?.some((r) => r.line === line)) {
        issue(
          `sets[${i}].ringerLines[${j}]`,
          `A ${tpl.title.toLowerCase()} has no ringer strap for line ${line}`,
        );
      }
    });
    if (tpl) leadChangeIssues(tpl, s.leadChanges, `sets[${i}].leadChanges`, issue);
  });
  plan.addOns.forEach((a, i) => {
    const tpl = checkTemplate(a.template, 'add-on', `addOns[${i}].template`);
    if (!setIds.has(a.serves)) {
      const what = ids.has(a.serves)
        ? `"${a.serves}" is not a key set`
        : `No key set "${a.serves}" in the plan`;
      issue(`addOns[${i}].serves`, `${what}; an add-on serves a key set`);
    }
    if (tpl) leadChangeIssues(tpl, a.leadChanges, `addOns[${i}].leadChanges`, issue);
  });
  plan.adapters.forEach((a, i) => checkTemplate(a.template, 'adapter', `adapters[${i}].template`));
  plan.required.handsFreeSets.forEach((id, i) => {
    if (!setIds.has(id)) issue(`required.handsFreeSets[${i}]`, `No key set "${id}" in the plan`);
  });

  // Cables.
  const ports = portsOf(plan);
  const usedBy = new Map<string, string>();
  plan.cables.forEach((c, i) => {
    const ends: { ref: PortRef; path: string }[] = [
      { ref: c.from, path: `cables[${i}].from` },
      { ref: c.to, path: `cables[${i}].to` },
    ];
    const found: (PortInfo | undefined)[] = ends.map(({ ref, path }) => {
      const part = ports.get(ref.part);
      if (!part) {
        issue(`${path}.part`, `No part "${ref.part}" in the plan`);
        return undefined;
      }
      const port = part.ports.get(ref.port);
      if (!port) {
        const names = [...part.ports.keys()].join(', ') || 'none';
        issue(`${path}.port`, `${part.name} has no port "${ref.port}" (its ports: ${names})`);
        return undefined;
      }
      const key = `${ref.part}/${ref.port}`;
      const other = usedBy.get(key);
      if (other) issue(`${path}.port`, `${part.name}'s ${ref.port} is already used by cable ${other}`);
      else usedBy.set(key, c.id);
      return port;
    });
    const [a, b] = found;
    if (c.from.part === c.to.part) issue(`cables[${i}].to.part`, 'A cable cannot join a part to itself');
    else if (a && b && a.gender === b.gender) {
      issue(`cables[${i}].to.port`, `Both ends are ${a.gender}s; a cable joins a plug to a jack`);
    }
    wiringFaultIssues(c.faults ?? [], `cables[${i}].faults`, issue);
  });
  return issues;
}

/** A split needs two different pairs, and one pair of a cable carries at most one wiring fault. */
function wiringFaultIssues(
  faults: readonly WiringFault[],
  path: string,
  issue: (path: string, message: string) => void,
): void {
  const faultOn = new Map<number, number>();
  const claim = (pair: number, j: number, field: 'pair' | 'withPair') => {
    const first = faultOn.get(pair);
    if (first !== undefined) {
      issue(`${path}[${j}].${field}`, `Pair ${pair} already has a wiring fault in this cable (${path}[${first}])`);
    } else faultOn.set(pair, j);
  };
  faults.forEach((f, j) => {
    claim(f.pair, j, 'pair');
    if (f.kind !== 'split-pair') return;
    if (f.withPair === f.pair) issue(`${path}[${j}].withPair`, 'A split pair needs two different pairs');
    else claim(f.withPair, j, 'withPair');
  });
}

function leadChangeIssues(
  tpl: PartTemplate,
  changes: Plan['sets'][number]['leadChanges'],
  path: string,
  issue: (path: string, message: string) => void,
): void {
  if (!tpl.leadPort) {
    if (changes.length) issue(path, `A ${tpl.title.toLowerCase()} has no leads to change`);
    return;
  }
  const occupied = new Set(tpl.leads.map((l) => l.pair));
  const current = new Set(occupied);
  changes.forEach((ch, j) => {
    if (!current.has(ch.pair)) {
      issue(`${path}[${j}].pair`, `Pair ${ch.pair} carries no leads here at that point`);
      return;
    }
    if (ch.kind === 'move') {
      if (ch.toPair === ch.pair) issue(`${path}[${j}].toPair`, 'Moving a pair onto itself changes nothing');
      else if (current.has(ch.toPair))
        issue(`${path}[${j}].toPair`, `Pair ${ch.toPair} already carries leads; move onto a spare pair`);
      else {
        current.delete(ch.pair);
        current.add(ch.toPair);
      }
    } else if (ch.conductor === 'both') {
      current.delete(ch.pair);
    }
  });
}
