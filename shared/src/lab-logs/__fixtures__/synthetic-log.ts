import type { ChemistryPort } from '../../thermal/chemistry-port';
import { mulberry32, normalSampler } from '../monte-carlo';
import { simulateScenario, type LabScenario, type ModelParameters } from '../scenario';

/**
 * A recorded test made up from the model itself: the scenario simulated with known parameters,
 * sampled every `everySec` seconds, with Gaussian noise of `noiseK` (seeded), for tests that
 * must recover those parameters.
 */
export function syntheticSamples(port: ChemistryPort, scenario: LabScenario, truth: ModelParameters, options: { everySec?: number; noiseK?: number; seed?: number } = {}) {
  const every = options.everySec ?? 10;
  const profile = simulateScenario(port, scenario, truth, { curveStepMin: every / 60 });
  const gauss = normalSampler(mulberry32(options.seed ?? 42));
  const noise = options.noiseK ?? 0.1;
  return profile.curve.map((p) => ({ tSec: Math.round(p.tMin * 60 * 1000) / 1000, tempC: p.tempC + noise * gauss() }));
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A logger-style CSV: a preamble, `Date Time` clock stamps from `start` (UTC), the pack in °F and an ambient probe in °F. */
export function loggerCsv(samples: readonly { tSec: number; tempC: number }[], options: { start?: string; ambientC?: number; delimiter?: string; fahrenheit?: boolean } = {}): string {
  const start = Date.parse(options.start ?? '2025-03-14T09:58:30Z');
  const d = options.delimiter ?? ',';
  const f = options.fahrenheit ?? true;
  const conv = (c: number) => (f ? (c * 9) / 5 + 32 : c);
  const unit = f ? '°F' : '°C';
  const lines = ['Logger,Bench probe TL-2', 'Serial,0042-17', '', ['Date Time', `Pack (${unit})`, `Ambient (${unit})`].join(d)];
  for (const s of samples) {
    const t = new Date(start + Math.round(s.tSec) * 1000);
    const stamp = `${t.getUTCFullYear()}-${pad(t.getUTCMonth() + 1)}-${pad(t.getUTCDate())} ${pad(t.getUTCHours())}:${pad(t.getUTCMinutes())}:${pad(t.getUTCSeconds())}`;
    lines.push([stamp, conv(s.tempC).toFixed(2), conv(options.ambientC ?? 24).toFixed(2)].join(d));
  }
  return lines.join('\n') + '\n';
}
