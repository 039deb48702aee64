/**
 * What a handset hears, synthesised with Web Audio from the engine's tone mix and TONES table.
 * Each (tone, line) pair is its own source, so two lines joined on one handset sound as two tones
 * summed. Nothing is created before `enable()`, which must run inside a user gesture.
 */
import { computed, onBeforeUnmount, ref, watch, type Ref } from 'vue';
import { TONES, type ToneName } from '@shared/engine';

export interface ToneOnLine {
  tone: ToneName;
  line: number;
}

interface Source {
  startedAt: number;
  tone: ToneName;
  oscillators: AudioScheduledSourceNode[];
  gate: GainNode;
  lit: boolean;
}

const TICK_MS = 20;
/** Each source's share of full scale, so a few summed tones stay clear of clipping. */
const SOURCE_LEVEL = 0.18;

export function toneKey(t: ToneOnLine): string {
  return `${t.tone}@${t.line}`;
}

/** Whether a tone with this cadence is sounding `elapsedMs` after it started. */
export function toneIsOn(tone: ToneName, elapsedMs: number): boolean {
  const spec = TONES[tone];
  if (!spec.offMs) return true;
  return elapsedMs % (spec.onMs + spec.offMs) < spec.onMs;
}

/**
 * A stand-in for a far party talking (a tone with no frequencies): band-limited noise whose level rises
 * and falls at a syllable-like rate, so it reads as speech on a line rather than as a signal.
 */
function murmur(ctx: AudioContext, out: GainNode): AudioScheduledSourceNode[] {
  const buffer = ctx.createBuffer(1, ctx.sampleRate * 2, ctx.sampleRate);
  const data = buffer.getChannelData(0);
  for (let i = 0; i < data.length; i += 1) data[i] = Math.random() * 2 - 1;
  const noise = ctx.createBufferSource();
  noise.buffer = buffer;
  noise.loop = true;
  const band = ctx.createBiquadFilter();
  band.type = 'bandpass';
  band.frequency.value = 700;
  band.Q.value = 0.8;
  const level = ctx.createGain();
  level.gain.value = 0.5;
  const syllables = ctx.createOscillator();
  syllables.frequency.value = 4;
  const depth = ctx.createGain();
  depth.gain.value = 0.5;
  syllables.connect(depth).connect(level.gain);
  noise.connect(band).connect(level).connect(out);
  noise.start();
  syllables.start();
  return [noise, syllables];
}

export function useHandsetAudio(tones: Ref<ToneOnLine[]>) {
  const enabled = ref(false);
  const volume = ref(0.6);
  const muted = ref(false);
  const supported = typeof globalThis.AudioContext === 'function';

  let ctx: AudioContext | null = null;
  let master: GainNode | null = null;
  let timer: ReturnType<typeof setInterval> | null = null;
  const sources = new Map<string, Source>();

  const wanted = computed(() => [...new Set(tones.value.map(toneKey))].sort().join(','));

  function masterLevel() {
    return muted.value ? 0 : volume.value;
  }

  function startSource(t: ToneOnLine) {
    if (!ctx || !master) return;
    const spec = TONES[t.tone];
    const gate = ctx.createGain();
    gate.gain.value = 0;
    gate.connect(master);
    const oscillators: AudioScheduledSourceNode[] = spec.frequencies.length
      ? spec.frequencies.map((f) => {
          const osc = ctx!.createOscillator();
          osc.type = 'sine';
          osc.frequency.value = f;
          osc.connect(gate);
          osc.start();
          return osc;
        })
      : murmur(ctx, gate);
    sources.set(toneKey(t), { startedAt: ctx.currentTime, tone: t.tone, oscillators, gate, lit: false });
  }

  function stopSource(key: string) {
    const s = sources.get(key);
    if (!s) return;
    s.oscillators.forEach((o) => {
      o.stop();
      o.disconnect();
    });
    s.gate.disconnect();
    sources.delete(key);
  }

  /** Open or close each source's gate in its own cadence; ramps avoid clicks at the edges. */
  function tick() {
    if (!ctx) return;
    for (const s of sources.values()) {
      const on = toneIsOn(s.tone, (ctx.currentTime - s.startedAt) * 1000);
      if (on === s.lit) continue;
      s.lit = on;
      const level = on ? SOURCE_LEVEL / Math.max(1, s.oscillators.length) : 0;
      s.gate.gain.setTargetAtTime(level, ctx.currentTime, 0.004);
    }
  }

  function sync() {
    if (!enabled.value || !ctx) return;
    const next = new Map(tones.value.map((t) => [toneKey(t), t]));
    for (const key of [...sources.keys()]) if (!next.has(key)) stopSource(key);
    for (const [key, t] of next) if (!sources.has(key)) startSource(t);
  }

  async function enable() {
    if (!supported) return;
    ctx ??= new AudioContext();
    if (!master) {
      master = ctx.createGain();
      master.gain.value = masterLevel();
      master.connect(ctx.destination);
    }
    await ctx.resume();
    enabled.value = true;
    timer ??= setInterval(tick, TICK_MS);
    sync();
    tick();
  }

  function disable() {
    enabled.value = false;
    for (const key of [...sources.keys()]) stopSource(key);
    if (timer) clearInterval(timer);
    timer = null;
    void ctx?.suspend();
  }

  watch(wanted, () => sync());
  watch([volume, muted], () => {
    if (ctx && master) master.gain.setTargetAtTime(masterLevel(), ctx.currentTime, 0.01);
  });

  onBeforeUnmount(() => {
    disable();
    void ctx?.close();
    ctx = null;
    master = null;
  });

  return { supported, enabled, volume, muted, enable, disable };
}
