/**
 * What a set sounds, played with Web Audio from the tone plan (tone-plan.ts): the tones its handset hears, each
 * (tone, line) its own source with its line circuit's own frequency and level, so two lines joined on one
 * handset sound as two; the set's ringer and intercom buzzer; and a click when the handset seizes a line.
 * Nothing is created before `enable()`, which must run inside a user gesture.
 */
import { computed, onBeforeUnmount, ref, watch, type Ref } from 'vue';
import { TONES, type ToneName } from '@shared/engine';
import { SEIZE_CLICK, dbToGain, isSounding, newlySeized, setVoices, type Voice } from './tone-plan';

export interface ToneOnLine {
  tone: ToneName;
  line: number;
}

/** What the set does besides its handset's tones; absent parts stay silent. */
export interface SetAlerts {
  ringer?: boolean;
  buzzer?: boolean;
  /** Lines the handset reaches; a newly reached one clicks. */
  hears?: number[];
}

interface Source {
  startedAt: number;
  voice: Voice;
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
  return isSounding(TONES[tone], elapsedMs);
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

/** A short decaying noise burst: the click of a line seized. */
function click(ctx: AudioContext, out: GainNode): void {
  const length = Math.ceil((ctx.sampleRate * SEIZE_CLICK.durationMs) / 1000);
  const buffer = ctx.createBuffer(1, length, ctx.sampleRate);
  const data = buffer.getChannelData(0);
  for (let i = 0; i < length; i += 1) data[i] = (Math.random() * 2 - 1) * (1 - i / length) ** 2;
  const burst = ctx.createBufferSource();
  burst.buffer = buffer;
  const level = ctx.createGain();
  level.gain.value = dbToGain(SEIZE_CLICK.levelDb) * SOURCE_LEVEL * 2;
  burst.connect(level).connect(out);
  burst.onended = () => level.disconnect();
  burst.start();
}

export function useHandsetAudio(tones: Ref<ToneOnLine[]>, alerts?: Ref<SetAlerts | null | undefined>) {
  const enabled = ref(false);
  const volume = ref(0.6);
  const muted = ref(false);
  const supported = typeof globalThis.AudioContext === 'function';

  let ctx: AudioContext | null = null;
  let master: GainNode | null = null;
  let timer: ReturnType<typeof setInterval> | null = null;
  const sources = new Map<string, Source>();

  const voices = computed(() =>
    setVoices(tones.value, { ringer: alerts?.value?.ringer, buzzer: alerts?.value?.buzzer }),
  );
  const wanted = computed(() => voices.value.map((v) => v.key).join(','));

  function masterLevel() {
    return muted.value ? 0 : volume.value;
  }

  function startSource(voice: Voice) {
    if (!ctx || !master) return;
    const gate = ctx.createGain();
    gate.gain.value = 0;
    let input: AudioNode = gate;
    const oscillators: AudioScheduledSourceNode[] = [];
    if (voice.modulationHz) {
      // The bell struck at the ringing frequency: its level swings fully at that rate.
      const strike = ctx.createGain();
      strike.gain.value = 0.5;
      const lfo = ctx.createOscillator();
      lfo.frequency.value = voice.modulationHz;
      const depth = ctx.createGain();
      depth.gain.value = 0.5;
      lfo.connect(depth).connect(strike.gain);
      lfo.start();
      oscillators.push(lfo);
      strike.connect(gate);
      input = strike;
    }
    gate.connect(master);
    if (voice.murmur) oscillators.push(...murmur(ctx, gate));
    for (const p of voice.partials) {
      const osc = ctx.createOscillator();
      osc.type = p.shape;
      osc.frequency.value = p.frequency;
      const share = ctx.createGain();
      share.gain.value = p.share;
      osc.connect(share).connect(input);
      osc.start();
      oscillators.push(osc);
    }
    sources.set(voice.key, { startedAt: ctx.currentTime, voice, oscillators, gate, lit: false });
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
      const on = isSounding(s.voice.cadence, (ctx.currentTime - s.startedAt) * 1000);
      if (on === s.lit) continue;
      s.lit = on;
      const level = on ? SOURCE_LEVEL * dbToGain(s.voice.levelDb) : 0;
      s.gate.gain.setTargetAtTime(level, ctx.currentTime, 0.004);
    }
  }

  function sync() {
    if (!enabled.value || !ctx) return;
    const next = new Map(voices.value.map((v) => [v.key, v]));
    for (const key of [...sources.keys()]) if (!next.has(key)) stopSource(key);
    for (const [key, voice] of next) if (!sources.has(key)) startSource(voice);
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
  watch(
    () => alerts?.value?.hears ?? [],
    (after, before) => {
      if (enabled.value && ctx && master && newlySeized(before ?? [], after).length) click(ctx, master);
    },
  );
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
