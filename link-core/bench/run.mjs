/**
 * link-core benchmarks, run against the built package (dist) on one core:
 *   npm run bench            (builds link-core first)
 * Each figure is one line `bench <name>: <value> <unit> (target <op> <value> <unit>)`.
 *
 * Times are CPU time of this process (see cpuSeconds), so a busy shared machine does not distort them.
 * Budgets: every evaluation is a different design drawn from a seeded generator before the clock
 * starts, so nothing can be answered from a cache; each figure is the median of five passes. Availability: ten years of hourly, time-stamped
 * visibility records (synthetic, seeded), median of repeated runs after a warm-up.
 * Batch kernel: a million seeded designs that differ in every numeric field (struct of arrays),
 * with and without the fade margin, and a 200 × 100 heat map. Beside it, the same designs and the
 * same records through our vectorised numpy twin (bench/budget_numpy.py, Debian's /usr/bin/python3),
 * timed warm in CPU time like ours; its margins are checked against ours before any ratio is printed.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { availabilityFromRecords, evaluateLink, evaluateLinkMargins, seededUniform, workedExampleDesign } from '@beamwright/link-core';

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

/** Largest difference accepted between the numpy twin's margins and link-core's [dB]. */
const NUMPY_MARGIN_TOLERANCE_DB = 1e-6;

function median(values) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1];
}

function parseReport(stdout) {
  try {
    return JSON.parse(stdout.trim().split('\n').pop());
  } catch {
    return undefined;
  }
}

/** A design as the flat field → value map the numpy twin reads (numeric fields only; collimated as 0). */
function flatDesign(design) {
  const flat = { rangeM: design.rangeM, systemMarginDb: design.systemMarginDb ?? 0 };
  for (const group of ['transmitter', 'receiver', 'pointing', 'atmosphere', 'scintillation']) {
    for (const [key, value] of Object.entries(design[group] ?? {})) if (typeof value === 'number') flat[`${group}.${key}`] = value;
  }
  flat['transmitter.halfAngleDivergenceRad'] ??= 0;
  flat['transmitter.m2'] ??= 1;
  flat['receiver.obscurationRatio'] ??= 0;
  return flat;
}

let availabilityJob;

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
  availabilityJob = { design, records, result: availabilityFromRecords(design, records), milliseconds: timings[5] };
}

// --- batch margin kernel ----------------------------------------------------------------------
/** The numeric fields the batch bench varies, and the kernel's columns for `count` seeded designs. */
function generateColumns(count, seed) {
  const random = seededUniform(seed);
  const uniform = (min, max) => min + (max - min) * random();
  const logUniform = (min, max) => Math.exp(uniform(Math.log(min), Math.log(max)));
  const column = (draw) => Float64Array.from({ length: count }, draw);
  // the same spans as generateDesigns; every point differs in every field
  return {
    rangeM: column(() => logUniform(200, 5000)),
    'transmitter.wavelengthM': column(() => WAVELENGTHS_M[Math.floor(random() * 4)]),
    'transmitter.powerDbm': column(() => uniform(5, 27)),
    'transmitter.waistRadiusM': column(() => uniform(0.0075, 0.04)),
    'transmitter.halfAngleDivergenceRad': column(() => (random() < 0.15 ? 0 : uniform(0.25e-3, 1.5e-3))),
    'transmitter.m2': column(() => uniform(1, 1.5)),
    'transmitter.opticsLossDb': column(() => uniform(1, 3)),
    'receiver.apertureDiameterM': column(() => uniform(0.05, 0.25)),
    'receiver.obscurationRatio': column(() => (random() < 0.3 ? uniform(0.1, 0.4) : 0)),
    'receiver.sensitivityDbm': column(() => uniform(-46, -20)),
    'receiver.opticsLossDb': column(() => uniform(1, 3)),
    'pointing.jitterSigmaPerAxisRad': column(() => logUniform(10e-6, 300e-6)),
    'pointing.staticErrorRad': column(() => uniform(0, 200e-6)),
    'atmosphere.visibilityM': column(() => logUniform(200, 50_000)),
    'atmosphere.cn2': column(() => logUniform(1e-16, 1e-13)),
    'scintillation.probability': column(() => (random() < 0.6 ? 1e-3 : logUniform(1e-6, 1e-2))),
    systemMarginDb: column(() => uniform(0, 3)),
  };
}

/** The base design of the batch bench: the worked example (Kim, 2 % visibility, Gaussian-beam model). */
function batchBase(includeScintillation) {
  return { ...workedExampleDesign(), scintillation: { include: includeScintillation, probability: 1e-3 } };
}

/** Median designs/s over `passes` passes of the kernel over the same columns (warm: a pass on other designs first). */
function batchRate(includeScintillation, count, passes) {
  const design = batchBase(includeScintillation);
  evaluateLinkMargins(design, generateColumns(Math.min(count, 50_000), 2));
  const columns = generateColumns(count, 30);
  const margins = new Float64Array(count);
  const rates = [];
  for (let pass = 0; pass < passes; pass++) rates.push(count / cpuSeconds(() => evaluateLinkMargins(design, columns, margins)));
  for (const margin of margins) if (!Number.isFinite(margin)) throw new Error('a batch margin was not finite');
  const sorted = [...rates].sort((a, b) => a - b);
  return { rate: sorted[passes >> 1], rates, columns, margins, design };
}

let batchJob;
{
  const { rate, rates, columns, margins, design } = batchRate(false, 1_000_000, 5);
  line('budget-batch-no-scintillation', Math.round(rate), 'designs/s', '>=', 2_000_000);
  note(`budget-batch-no-scintillation passes over 1000000 designs: ${rates.map(Math.round).join(', ')} designs/s (load average ${loadAverage()})`);
  batchJob = { columns, margins, design, rate };
}
{
  const { rate, rates } = batchRate(true, 1_000_000, 3);
  line('budget-batch-gamma-gamma', Math.round(rate), 'designs/s', '>=', 200_000);
  note(`budget-batch-gamma-gamma passes over 1000000 designs: ${rates.map(Math.round).join(', ')} designs/s (load average ${loadAverage()})`);
}

// --- heat map: 200 ranges × 100 visibilities, fade margin on ------------------------------------
{
  const ranges = 200;
  const visibilities = 100;
  const rangeM = new Float64Array(ranges * visibilities);
  const visibilityM = new Float64Array(ranges * visibilities);
  // range the outer axis, visibility the inner one: the kernel computes the path part once per row
  for (let row = 0; row < ranges; row++) {
    for (let column = 0; column < visibilities; column++) {
      rangeM[row * visibilities + column] = 200 * Math.pow(5000 / 200, row / (ranges - 1));
      visibilityM[row * visibilities + column] = 100 * Math.pow(50_000 / 100, column / (visibilities - 1));
    }
  }
  const design = batchBase(true);
  const grid = { rangeM, 'atmosphere.visibilityM': visibilityM };
  const margins = new Float64Array(rangeM.length);
  for (let i = 0; i < 5; i++) evaluateLinkMargins(design, grid, margins);
  const timings = [];
  for (let i = 0; i < 11; i++) timings.push(1000 * cpuSeconds(() => evaluateLinkMargins(design, grid, margins)));
  timings.sort((a, b) => a - b);
  line('heat-map-200x100-range-visibility-gamma-gamma', timings[5].toFixed(2), 'ms', '<', 20);
}

// --- side by side with numpy ---------------------------------------------------------------------
/**
 * The same designs and records through bench/budget_numpy.py. Prints "skipped: <why>" when Debian's
 * python3 or its numpy/scipy is not there (the bench never installs them).
 */
{
  const python = '/usr/bin/python3';
  const script = fileURLToPath(new URL('./budget_numpy.py', import.meta.url));
  const skip = (why) => {
    console.log(`bench budget-batch ratio vs numpy: skipped: ${why}`);
    console.log(`bench availability ratio vs numpy: skipped: ${why}`);
  };
  if (!existsSync(python)) skip(`${python} not found (apt-get install -y python3-numpy python3-scipy)`);
  else {
    const folder = mkdtempSync(join(tmpdir(), 'beamwright-bench-'));
    try {
      const fields = Object.keys(batchJob.columns);
      const count = batchJob.margins.length;
      const columnBytes = new Float64Array(fields.length * count);
      fields.forEach((field, i) => columnBytes.set(batchJob.columns[field], i * count));
      writeFileSync(join(folder, 'columns.f64'), new Uint8Array(columnBytes.buffer));
      const { design: availabilityDesign, records } = availabilityJob;
      const recordBytes = new Float64Array(2 * records.visibilityM.length);
      recordBytes.set(records.visibilityM, 0);
      recordBytes.set(records.timestampsMs, records.visibilityM.length);
      writeFileSync(join(folder, 'records.f64'), new Uint8Array(recordBytes.buffer));
      const base = batchJob.design;
      writeFileSync(
        join(folder, 'job.json'),
        JSON.stringify({
          count,
          fields,
          passes: 5,
          kruse: base.atmosphere.model === 'kruse',
          morInput: base.atmosphere.visibilityDefinition === 'mor-5-percent',
          gaussianBeam: (base.atmosphere.turbulenceModel ?? 'gaussian-beam') === 'gaussian-beam',
          recordsCount: records.visibilityM.length,
          recordsMor: records.visibilityDefinition === 'mor-5-percent',
          availabilityPasses: 11,
          availabilityDesign: flatDesign(availabilityDesign),
          availabilityKruse: availabilityDesign.atmosphere.model === 'kruse',
          availabilityGaussianBeam: (availabilityDesign.atmosphere.turbulenceModel ?? 'gaussian-beam') === 'gaussian-beam',
        }),
      );
      const run = spawnSync(python, [script, folder], { encoding: 'utf8', maxBuffer: 1 << 20 });
      const report = run.status === 0 ? parseReport(run.stdout) : undefined;
      if (report === undefined) skip(`budget_numpy.py failed (status ${run.status}): ${(run.stderr || run.stdout).trim().split('\n').pop()}`);
      else if (report.skipped) skip(report.skipped);
      else {
        // the numpy margins must be ours before a ratio means anything
        const numpyMargins = new Float64Array(readFileSync(join(folder, 'margins.f64')).buffer.slice(0));
        let worst = 0;
        for (let i = 0; i < count; i++) worst = Math.max(worst, Math.abs(numpyMargins[i] - batchJob.margins[i]));
        const agree = worst <= NUMPY_MARGIN_TOLERANCE_DB;
        note(`numpy ${report.numpy} margins against link-core's over ${count} designs: largest difference ${worst.toExponential(2)} dB (tolerance ${NUMPY_MARGIN_TOLERANCE_DB} dB)${agree ? '' : ' — DISAGREE, no ratio'}`);
        const numpyRate = count / median(report.budgetSeconds);
        note(`numpy budget-batch-no-scintillation: ${Math.round(numpyRate)} designs/s warm (median of ${report.budgetSeconds.length} passes: ${report.budgetSeconds.map((s) => (1000 * s).toFixed(0)).join(', ')} ms)`);
        note('numpy budget-batch-gamma-gamma: not run: numpy and scipy have no vectorised gamma-gamma quantile, so the twin computes the margin without the fade margin only (the line above compares like with like)');
        if (agree) line('budget-batch ratio vs numpy', (batchJob.rate / numpyRate).toFixed(2), 'x', '>=', 1.5);
        else console.log('bench budget-batch ratio vs numpy: not shown: the numpy margins disagree with link-core\'s');
        const ours = availabilityJob.result;
        const sameAvailability =
          Math.abs(report.availability - ours.availability) <= 1e-12 &&
          report.outageCount === ours.outageCount &&
          Math.abs(report.longestOutageH - ours.longestOutageH) <= 1e-9 &&
          Math.abs(report.worstMarginDb - ours.worstMarginDb) <= NUMPY_MARGIN_TOLERANCE_DB;
        const numpyMs = 1000 * median(report.availabilitySeconds);
        note(`numpy availability over ${ours.recordCount} records: ${numpyMs.toFixed(2)} ms warm; availability ${report.availability}, ${report.outageCount} outages, longest ${report.longestOutageH} h (link-core ${ours.availability}, ${ours.outageCount}, ${ours.longestOutageH} h)${sameAvailability ? '' : ' — DISAGREE, no ratio'}`);
        if (sameAvailability) line('availability ratio vs numpy', (numpyMs / availabilityJob.milliseconds).toFixed(2), 'x', '>=', 1);
        else console.log('bench availability ratio vs numpy: not shown: the numpy availability disagrees with link-core\'s');
      }
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  }
}
