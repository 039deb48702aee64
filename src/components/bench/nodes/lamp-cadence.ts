/**
 * Lamp cadences as CSS animations. The timing comes from the engine's CADENCES table, so a flash on
 * the canvas keeps exactly the rhythm the engine models; the keyframes are written once per page.
 */
import { CADENCES, type Cadence } from '@shared/engine';

const STYLE_ID = 'lb-lamp-cadences';

export const CADENCE_WORDS: Record<Cadence, string> = {
  dark: 'dark',
  steady: 'steady',
  flash: 'flashing',
  wink: 'winking',
};

/** CSS for one class per cadence: lit for `onMs` of every `periodMs`, then dark. */
export function cadenceCss(): string {
  const rules: string[] = [];
  for (const [name, timing] of Object.entries(CADENCES) as [Cadence, (typeof CADENCES)[Cadence]][]) {
    if (!timing || timing.onMs >= timing.periodMs) continue;
    const onPct = Math.min(100, Math.max(0, (timing.onMs / timing.periodMs) * 100)).toFixed(2);
    rules.push(
      `@keyframes lb-lamp-${name} { 0% { opacity: 1; } ${onPct}% { opacity: 0.12; } 100% { opacity: 0.12; } }`,
      `.lb-lamp--${name} .lb-lamp__bulb { animation: lb-lamp-${name} ${timing.periodMs}ms step-end infinite; }`,
    );
  }
  return rules.join('\n');
}

/** Write the cadence keyframes into the document once. */
export function ensureCadenceStyles(doc: Document | undefined = globalThis.document): void {
  if (!doc || doc.getElementById(STYLE_ID)) return;
  const style = doc.createElement('style');
  style.id = STYLE_ID;
  style.textContent = cadenceCss();
  doc.head.appendChild(style);
}

/** A negative delay that puts every lamp of one cadence in step, as they are on a real key strip. */
export function cadencePhaseDelay(cadence: Cadence, now = globalThis.performance?.now() ?? 0): string {
  const timing = CADENCES[cadence];
  if (!timing) return '0ms';
  return `-${Math.round(now % timing.periodMs)}ms`;
}
