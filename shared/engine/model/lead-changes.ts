/**
 * Lead changes, the restorer's work inside a set or an add-on: where each lead ends up, the leads a change
 * handles, how the work is worded on a work sheet, and what lifting leads costs the user (the cure's tie-break).
 */
import { pairColour, pinOf, conductorColour } from '../document/cable-code';
import { findAddOn, findLeadPart, servedName, type LeadPart } from '../document/parts';
import type { Conductor, LeadChange, Plan } from '../document/plan.schema';
import { listWords } from '../document/words';
import { lineOfDesignation } from '../templates/designations';
import { getTemplate } from '../templates/part-templates';
import type { LeadScope, LeadSpec } from '../templates/template.types';

/** The pair each lead ends up on after the lead changes, or null when lifted. */
export function applyLeadChanges(
  leads: readonly LeadSpec[],
  changes: readonly LeadChange[],
): (number | null)[] {
  const at: (number | null)[] = leads.map((l) => l.pair);
  for (const ch of changes) {
    if (ch.kind === 'lift') {
      leads.forEach((l, i) => {
        if (at[i] === ch.pair && (ch.conductor === 'both' || ch.conductor === l.conductor)) at[i] = null;
      });
    } else {
      const moving = leads.map((_, i) => at[i] === ch.pair);
      moving.forEach((m, i) => {
        if (m) at[i] = ch.toPair;
      });
    }
  }
  return at;
}

/** A lead of a set or add-on as it stands after the part's lead changes (pair null: lifted). */
export interface PlacedLead {
  pair: number | null;
  conductor: Conductor;
  scope: LeadScope;
  designation: string;
}

/** A set or add-on with its template leads where its lead changes have put them. */
export interface PartLeads {
  part: LeadPart;
  kind: 'set' | 'add-on';
  leads: PlacedLead[];
}

export function partLeads(plan: Plan, partId: string): PartLeads | null {
  const part = findLeadPart(plan, partId);
  const tpl = part ? getTemplate(part.template) : undefined;
  if (!part || !tpl) return null;
  const at = applyLeadChanges(tpl.leads, part.leadChanges);
  return {
    part,
    kind: findAddOn(plan, partId) ? 'add-on' : 'set',
    leads: tpl.leads.map((l, i) => ({
      pair: at[i],
      conductor: l.conductor,
      scope: l.scope,
      designation: l.designation,
    })),
  };
}

// ---------------------------------------------------------------------------------------------------------------
// What lifting costs

/** What lifting some leads of a part takes away, judged by the leads' scope. */
type LiftEffect = 'add-on' | 'buzzer' | 'line' | 'unused-line' | 'hands-free' | 'no-add-on' | 'nothing';

interface LiftContext {
  name: string;
  served: string;
  /** Lines of the lifted line leads the KSU has, and all of them. */
  live: number[];
  lines: number[];
}

/**
 * Each effect's wording in the two places it is shown: `brief` in the cure's list of changes, `sheet` as a sentence
 * on the printed work sheet; `rank` orders change sets of one size in the cure (cheapest first).
 */
const LIFT_COSTS: Record<
  LiftEffect,
  { rank: number; brief(c: LiftContext): string; sheet(c: LiftContext): string }
> = {
  'no-add-on': {
    rank: 1,
    brief: (c) => `none: ${c.name} has no hands-free add-on (it can no longer take one)`,
    sheet: (c) => `None today: ${c.name} has no hands-free add-on (it can no longer take one).`,
  },
  'unused-line': {
    rank: 5,
    brief: (c) =>
      `none today: the KSU has no line ${c.lines.join(' or ')}; ${c.name} could not use it if one is added`,
    sheet: (c) =>
      `None today: the KSU has no line ${listWords(c.lines)}; ${c.name} could not use it if one is added.`,
  },
  'hands-free': {
    rank: 50,
    brief: (c) => `${c.name} loses its hands-free connection`,
    sheet: (c) => `${c.name} loses its hands-free connection.`,
  },
  'add-on': {
    rank: 60,
    brief: (c) => `${c.name} no longer works for ${c.served}`,
    sheet: (c) => `${c.name} no longer works for ${c.served}: its hands-free stops.`,
  },
  buzzer: {
    rank: 80,
    brief: (c) => `${c.name} no longer buzzes for intercom calls`,
    sheet: (c) => `${c.name} no longer buzzes for intercom calls.`,
  },
  line: {
    rank: 100,
    brief: (c) => `${c.name} loses line ${c.live.join(' and ')}`,
    sheet: (c) => `${c.name} loses line ${listWords(c.live)}.`,
  },
  nothing: {
    rank: 0,
    brief: () => 'none: the pair carries no lead in this part',
    sheet: () => 'None: the pair carries no lead in this part.',
  },
};

/** What lifting these leads of the part costs: its wording for the cure and the sheet, and the cure's rank. */
export function liftCost(
  plan: Plan,
  part: LeadPart,
  leads: readonly Pick<PlacedLead, 'scope' | 'designation'>[],
): { brief: string; sheet: string; rank: number } {
  const addOn = findAddOn(plan, part.id);
  const scopes = new Set(leads.map((l) => l.scope));
  const onKsu = new Set(plan.ksu.lines.map((l) => l.number));
  const lines = [...new Set(leads.map((l) => lineOfDesignation(l.designation)).filter((l) => l !== null))];
  const live = lines.filter((l) => onKsu.has(l));
  const effect: LiftEffect = addOn
    ? 'add-on'
    : leads.length === 0
      ? 'nothing'
      : scopes.has('station')
        ? 'buzzer'
        : scopes.has('bus')
          ? live.length > 0
            ? 'line'
            : 'unused-line'
          : plan.addOns.some((a) => a.serves === part.id)
            ? 'hands-free'
            : 'no-add-on';
  const context: LiftContext = { name: part.name, served: addOn ? servedName(plan, addOn) : '', live, lines };
  const cost = LIFT_COSTS[effect];
  return { brief: cost.brief(context), sheet: cost.sheet(context), rank: cost.rank };
}

// ---------------------------------------------------------------------------------------------------------------
// The work, in words

/** One conductor a lead change handles: its designation, the part's terminal and the cord pin of its pair. */
export interface ChangedLead {
  conductor: Conductor;
  colour: string;
  designation: string;
  terminal: string;
  pin: number;
}

const CONDUCTORS: readonly Conductor[] = ['tip', 'ring'];

function pairText(pair: number): string {
  return `pair ${pair} (${pairColour(pair).name})`;
}

/** The template leads of the pair, tip first, limited to the conductors the change handles. */
function changedLeads(
  leads: readonly LeadSpec[],
  pair: number,
  conductors: readonly Conductor[],
): ChangedLead[] {
  return CONDUCTORS.filter((c) => conductors.includes(c)).flatMap((conductor) => {
    const spec = leads.find((l) => l.pair === pair && l.conductor === conductor);
    return spec
      ? [
          {
            conductor,
            colour: conductorColour(pair, conductor),
            designation: spec.designation,
            terminal: spec.terminal,
            pin: pinOf(pair, conductor),
          },
        ]
      : [];
  });
}

function liftAction(kind: 'set' | 'add-on', pair: number, leads: ChangedLead[], both: boolean): string {
  const where = kind === 'set' ? 'the set' : 'the add-on';
  const which = both ? 'both leads' : `the ${leads[0]?.conductor ?? 'lead'} lead`;
  const each = leads.map((l) => `${l.conductor} (${l.colour}, cord pin ${l.pin}) off terminal ${l.terminal}`);
  const kept = both ? '' : ` Leave the ${leads[0]?.conductor === 'tip' ? 'ring' : 'tip'} lead on.`;
  return `Lift ${which} of ${pairText(pair)} inside ${where}: ${listWords(each)}; insulate each end and tie it back.${kept}`;
}

function moveAction(pair: number, toPair: number, leads: ChangedLead[]): string {
  const each = leads.map(
    (l) =>
      `at terminal ${l.terminal} take off the ${l.colour} ${l.conductor} (pin ${l.pin}) and land the ${conductorColour(toPair, l.conductor)} ${l.conductor} of pair ${toPair} (pin ${pinOf(toPair, l.conductor)})`,
  );
  return `Re-terminate ${pairText(pair)} leads on spare ${pairText(toPair)}: ${each.join('; ')}. Insulate the freed ${pairColour(pair).name} leads.`;
}

function moveCost(name: string, buzzer: boolean, pair: number, toPair: number): string {
  const what = buzzer ? `its intercom buzzer` : `these leads`;
  return `None once the KSU feeds pair ${toPair} on ${name}'s station port (see KSU cross-connect) — ${what} then work only on pair ${toPair}; pair ${pair} is free afterwards.`;
}

/** One lead change of a set or add-on as work to do: the leads it handles, the instruction and its cost. */
export function leadChangeWork(
  plan: Plan,
  partId: string,
  change: LeadChange,
): { leads: ChangedLead[]; action: string; cost: string } | null {
  const part = findLeadPart(plan, partId);
  if (!part) return null;
  const kind = findAddOn(plan, partId) ? 'add-on' : 'set';
  const specs = getTemplate(part.template)?.leads ?? [];
  const onPair = specs.filter((l) => l.pair === change.pair);
  if (change.kind === 'move') {
    const leads = changedLeads(specs, change.pair, CONDUCTORS);
    const first = onPair.find((l) => l.conductor === 'tip') ?? onPair[0];
    const buzzer = first?.scope === 'station';
    return {
      leads,
      action: moveAction(change.pair, change.toPair, leads),
      cost: moveCost(part.name, buzzer, change.pair, change.toPair),
    };
  }
  const conductor = change.conductor;
  const both = conductor === 'both';
  const leads = changedLeads(specs, change.pair, conductor === 'both' ? CONDUCTORS : [conductor]);
  const lifted = onPair.filter((l) => leads.some((c) => c.conductor === l.conductor));
  return {
    leads,
    action: liftAction(kind, change.pair, leads, both),
    cost: liftCost(plan, part, lifted).sheet,
  };
}
