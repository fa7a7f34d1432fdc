/**
 * The margin of a few typical and a few narrow-beam designs under two engines, and which term moved:
 *   node link-core/bench/margin-before-after.mjs <path to the older engine's dist/index.js>
 * (build the older engine from its commit first). Prints a Markdown table. The designs are our own
 * illustrations, not measured links.
 */
import { pathToFileURL } from 'node:url';
import { evaluateLink, workedExampleDesign } from '@beamwright/link-core';

const older = await import(pathToFileURL(process.argv[2]).href);

// every design starts from the repository's one worked example (LB-01, METHODS.md §10.1)
const base = (over) => ({ ...workedExampleDesign(), ...over });
const narrow = (rangeM, waistRadiusM, cn2, extra = {}) =>
  base({
    rangeM,
    transmitter: { wavelengthM: 1.55e-6, powerDbm: 10, waistRadiusM, opticsLossDb: 1 },
    pointing: { jitterSigmaPerAxisRad: 10e-6, staticErrorRad: 10e-6 },
    atmosphere: { model: 'kim', visibilityM: 10_000, cn2 },
    ...extra,
  });

const designs = [
  ['typical: 2 km, 1 mrad, 10 cm (LB-01)', base({})],
  ['typical: 1 km, 2 mrad, 8 cm, obscured 0.3', base({ rangeM: 1000, transmitter: { wavelengthM: 850e-9, powerDbm: 17, waistRadiusM: 0.02, halfAngleDivergenceRad: 2e-3, opticsLossDb: 1 }, receiver: { apertureDiameterM: 0.08, sensitivityDbm: -40, opticsLossDb: 1.5, obscurationRatio: 0.3 } })],
  ['typical: 3 km, 0.5 mrad, 20 cm, Cn² 1e-14', base({ rangeM: 3000, transmitter: { wavelengthM: 1.55e-6, powerDbm: 23, waistRadiusM: 0.03, halfAngleDivergenceRad: 0.5e-3, opticsLossDb: 1 }, receiver: { apertureDiameterM: 0.2, sensitivityDbm: -40, opticsLossDb: 1.5 }, atmosphere: { model: 'kim', visibilityM: 8000, cn2: 1e-14 } })],
  ['narrow: 3 km collimated 25 mm, Cn² 5e-14', narrow(3000, 0.025, 5e-14)],
  ['narrow: 2 km collimated 10 mm, Cn² 1e-13', narrow(2000, 0.01, 1e-13)],
  ['narrow: 5 km collimated 25 mm, Cn² 1e-14', narrow(5000, 0.025, 1e-14)],
  ['narrow: 300 m collimated 10 mm, 20 cm obscured 0.4, jitter 50 µrad', narrow(300, 0.01, 1e-14, { receiver: { apertureDiameterM: 0.2, sensitivityDbm: -36, opticsLossDb: 1.5, obscurationRatio: 0.4 }, pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 30e-6 } })],
];

const byKey = (budget) => Object.fromEntries(budget.terms.map((t) => [t.key, t.valueDb]));
console.log('| design | margin before [dB] | margin after [dB] | change [dB] | terms that moved (after − before, dB) |');
console.log('|---|---:|---:|---:|---|');
for (const [label, design] of designs) {
  const before = older.evaluateLink(design);
  const after = evaluateLink(design);
  const a = byKey(after);
  const b = byKey(before);
  const moved = Object.keys(a)
    .map((key) => [key, (a[key] ?? 0) - (b[key] ?? 0)])
    .filter(([, change]) => Math.abs(change) >= 0.005)
    .map(([key, change]) => `${key} ${change > 0 ? '+' : ''}${change.toFixed(2)}`)
    .join(', ');
  console.log(`| ${label} | ${before.linkMarginDb.toFixed(2)} | ${after.linkMarginDb.toFixed(2)} | ${(after.linkMarginDb - before.linkMarginDb).toFixed(2)} | ${moved || '—'} |`);
}
