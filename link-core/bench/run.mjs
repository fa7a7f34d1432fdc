/**
 * link-core benchmarks, run against the built package (dist) on one core:
 *   npm run bench            (builds link-core first)
 * Each figure is one line `bench <name>: <value> <unit> (target <op> <value> <unit>)`.
 *
 * Times are CPU time of this process (see cpuSeconds), so a busy shared machine does not distort them.
 * Budgets: every evaluation is a different design drawn from a seeded generator before the clock
 * starts, so nothing can be answered from a cache; each figure is the median of five passes. Availability: ten years of hourly, time-stamped
 * visibility records (synthetic, seeded), median of repeated runs after a warm-up.
 */
import { loadavg } from 'node:os';
import { availabilityFromRecords, evaluateLink, seededUniform } from '@beamwright/link-core';

const loadAverage = () => loadavg()[0].toFixed(1);


const WAVELENGTHS_M = [785e-9, 850e-9, 1310e-9, 1550e-9];

/** Designs across the span of practice (METHODS.md §6.1, §7): ranges 0.2–5 km, fog to clear air, calm to strong turbulence. */
function generateDesigns(count, seed, includeScintillation) {
  const random = seededUniform(seed);
  const uniform = (min, max) => min + (max - min) * random();
  const logUniform = (min, max) => Math.exp(uniform(Math.log(min), Math.log(max)));
  const designs = new Array(count);
  for (let i = 0; i < count; i++) {
    designs[i] = {
      rangeM: logUniform(200, 5000),
      transmitter: {
        wavelengthM: WAVELENGTHS_M[Math.floor(random() * 4)],
        powerDbm: uniform(5, 27),
        waistRadiusM: uniform(0.0075, 0.04),
        halfAngleDivergenceRad: random() < 0.15 ? undefined : uniform(0.25e-3, 1.5e-3),
        m2: uniform(1, 1.5),
        opticsLossDb: uniform(1, 3),
      },
      receiver: {
        apertureDiameterM: uniform(0.05, 0.25),
        sensitivityDbm: uniform(-46, -20),
        opticsLossDb: uniform(1, 3),
        obscurationRatio: random() < 0.3 ? uniform(0.1, 0.4) : 0,
      },
      pointing: { jitterSigmaPerAxisRad: logUniform(10e-6, 300e-6), staticErrorRad: uniform(0, 200e-6) },
      atmosphere: {
        model: random() < 0.9 ? 'kim' : 'kruse',
        visibilityM: logUniform(200, 50_000),
        visibilityDefinition: random() < 0.8 ? 'contrast-2-percent' : 'mor-5-percent',
        cn2: logUniform(1e-16, 1e-13),
      },
      scintillation: { include: includeScintillation, probability: random() < 0.6 ? 1e-3 : logUniform(1e-6, 1e-2) },
      systemMarginDb: uniform(0, 3),
    };
  }
  return designs;
}

/**
 * Seconds of CPU time this process spent running `work`. The machine may be shared (CI runners,
 * several jobs on two cores): CPU time measures what one core delivers, where wall time would
 * measure the neighbours. Single-threaded code, so CPU time ≈ wall time on an idle machine.
 */
function cpuSeconds(work) {
  const before = process.cpuUsage();
  work();
  const used = process.cpuUsage(before);
  return (used.user + used.system) / 1e6;
}

/** Budgets per second of CPU time, and per second of wall time (reported beside it for transparency). */
function budgetsPerSecond(designs) {
  let checksum = 0;
  const wallStart = process.hrtime.bigint();
  const seconds = cpuSeconds(() => {
    for (let i = 0; i < designs.length; i++) checksum += evaluateLink(designs[i]).linkMarginDb;
  });
  const wallSeconds = Number(process.hrtime.bigint() - wallStart) / 1e9;
  if (!Number.isFinite(checksum)) throw new Error('a budget was not finite');
  return { rate: designs.length / seconds, wallRate: designs.length / wallSeconds };
}

function note(text) {
  console.log(`# ${text}`);
}

function line(name, value, unit, op, target) {
  console.log(`bench ${name}: ${value} ${unit} (target ${op} ${target} ${unit})`);
}

/**
 * Median over five timed passes, each over its own freshly generated designs (every evaluation in
 * the benchmark is of a different design). Passes are kept small so the heap stays small; the
 * median discards a pass that a major collection or a busy neighbour happened to hit.
 */
function medianBudgetRate(count, firstSeed, includeScintillation) {
  const passes = [];
  for (let pass = 0; pass < 5; pass++) passes.push(budgetsPerSecond(generateDesigns(count, firstSeed + pass, includeScintillation)));
  const rates = passes.map((pass) => Math.round(pass.rate));
  passes.sort((a, b) => a.rate - b.rate);
  return { ...passes[2], rates };
}

// --- budgets without scintillation -------------------------------------------------------------
{
  budgetsPerSecond(generateDesigns(100_000, 1, false)); // warm-up on other designs
  const { rate, wallRate, rates } = medianBudgetRate(100_000, 10, false);
  line('budget-evaluations-no-scintillation', Math.round(rate), 'budgets/s', '>=', 1_000_000);
  note(`budget-evaluations-no-scintillation passes: ${rates.join(', ')} budgets/s; median pass by wall clock ${Math.round(wallRate)} (load average ${loadAverage()})`);
}

// --- budgets with the gamma-gamma fade margin --------------------------------------------------
{
  budgetsPerSecond(generateDesigns(20_000, 3, true));
  const { rate, wallRate, rates } = medianBudgetRate(20_000, 20, true);
  line('budget-evaluations-gamma-gamma', Math.round(rate), 'budgets/s', '>=', 100_000);
  note(`budget-evaluations-gamma-gamma passes: ${rates.join(', ')} budgets/s; median pass by wall clock ${Math.round(wallRate)} (load average ${loadAverage()})`);
}

// --- availability over ten years of hourly records ---------------------------------------------
{
  const hours = 87_600;
  const random = seededUniform(5);
  const makeRecords = () => {
    const visibilityM = new Float64Array(hours);
    const timestampsMs = new Float64Array(hours);
    const startMs = Date.UTC(2015, 0, 1);
    let fogHoursLeft = 0;
    for (let i = 0; i < hours; i++) {
      timestampsMs[i] = startMs + i * 3_600_000;
      if (fogHoursLeft === 0 && random() < 0.002) fogHoursLeft = 1 + Math.floor(random() * 12);
      visibilityM[i] = fogHoursLeft > 0 ? Math.exp(Math.log(80) + random() * Math.log(30)) : Math.exp(Math.log(3000) + random() * Math.log(10));
      if (fogHoursLeft > 0) fogHoursLeft--;
    }
    return { visibilityM, timestampsMs, visibilityDefinition: 'mor-5-percent' };
  };
  const [design] = generateDesigns(1, 6, false);
  const warmUp = makeRecords();
  for (let i = 0; i < 5; i++) availabilityFromRecords(design, warmUp);
  const records = makeRecords();
  const timings = [];
  let availability = 0;
  for (let i = 0; i < 11; i++) {
    timings.push(1000 * cpuSeconds(() => (availability += availabilityFromRecords(design, records).availability)));
  }
  if (!Number.isFinite(availability)) throw new Error('availability was not finite');
  timings.sort((a, b) => a - b);
  line('availability-87600-hourly-records', timings[5].toFixed(2), 'ms', '<', 20);
}
