#!/usr/bin/python3
"""Vectorised numpy/scipy twin of link-core's batch margin kernel and ten-year availability, for
the side-by-side lines of `npm run bench` (link-core/bench/run.mjs runs it; it is not a test).

    /usr/bin/python3 link-core/bench/budget_numpy.py <folder>

The folder holds what run.mjs wrote: `job.json` (the base design's constants, the field order and
the pass count), `columns.f64` (one little-endian float64 column per varied field, the same seeded
designs link-core evaluates), `records.f64` (visibility, then timestamps, of the availability
records). The script writes `margins.f64` (its margin per design) and prints one JSON line with
its timings. Every figure is timed warm, in CPU time of the process (as run.mjs times its own
side): one untimed pass first, then the median of the passes
(a cold call of a vectorised numpy function is dominated by first-touch page faults of its
temporaries).

What it computes, in link-core's own formulas (link-core/METHODS.md):
- the margin of the batch kernel without the fade margin, for the bench's base design (Kim or
  Kruse visibility attenuation, 2 % or MOR visibility, the Gaussian-beam turbulence model or the
  spherical wave, mean-loss pointing): launched beam radius (§1.5), long-term radius in turbulence
  (§6.11, the smooth maximum of the weak and strong spreads), exact mean capture of the annular
  aperture under the Rician pointing error as a difference of noncentral chi-square CDFs
  (scipy.stats.ncx2, §3.6), visibility attenuation (§5.2–5.3) and the sums of §10.1;
- the availability over time-stamped visibility records (§11.3): the clear-air margin, one root
  for the visibility at which the attenuation uses it up (scipy.optimize.brentq on log V), then one
  comparison per record, with the record durations, gaps, outage count, longest outage and worst
  margin computed with array operations.
It does not compute the gamma-gamma fade margin (no vectorised gamma-gamma quantile exists in
numpy or scipy), outage-based pointing or Al Naboulsi's fog models: run.mjs only asks for what it
covers.
"""

import json
import math
import os
import sys
import time

try:
    import numpy as np
    from scipy import optimize, stats
except ImportError as error:
    print(json.dumps({"skipped": f"python package {error.name} missing (apt-get install -y python3-numpy python3-scipy)"}))
    sys.exit(0)

DB = 10.0 / math.log(10.0)  # dB per natural-log unit of a power ratio (METHODS.md §0)
MOR_TO_2_PERCENT = math.log(50.0) / math.log(20.0)  # METHODS.md §5.1
REFERENCE_WAVELENGTH_M = 550e-9
KOSCHMIEDER = 3.91
STRONG_OVER_WEAK_SIXTH = (1.63 / 1.33) ** 6


def visibility_exponent(kruse, v_km):
    """q(V) of Kim (METHODS.md §5.2) or Kruse (§5.3), V the 2 % visibility in km."""
    if kruse:
        return np.where(v_km > 50, 1.6, np.where(v_km > 6, 1.3, 0.585 * np.cbrt(v_km)))
    return np.where(v_km > 50, 1.6, np.where(v_km > 6, 1.3, np.where(v_km > 1, 0.16 * v_km + 0.34, np.where(v_km > 0.5, v_km - 0.5, 0.0))))


def attenuation_db_per_km(kruse, v_km, wavelength_m):
    q = visibility_exponent(kruse, v_km)
    return DB * (KOSCHMIEDER / v_km) * np.exp(-q * np.log(wavelength_m / REFERENCE_WAVELENGTH_M))


def capture_and_pointing_loss_db(c, gaussian_beam):
    """−10·log10 E[C(R; W_LT)]: the geometric, spread and pointing terms together (METHODS.md §10.1)."""
    wavelength, w0, theta, m2, length = c["transmitter.wavelengthM"], c["transmitter.waistRadiusM"], c["transmitter.halfAngleDivergenceRad"], c["transmitter.m2"], c["rangeM"]
    diffraction = m2 * wavelength / (np.pi * w0)
    excess = theta * theta - diffraction * diffraction
    defocus = np.sqrt(np.maximum(excess, 0.0))
    w = np.hypot(w0 + length * defocus, diffraction * length)
    if gaussian_beam:
        np.seterr(divide="ignore")  # ln 0 = −inf where Cn² = 0, whose spread is then exactly 0
        theta0 = 1.0 + length * defocus / w0
        lambda0 = diffraction * length / w0
        lam = lambda0 / (theta0 * theta0 + lambda0 * lambda0)
        k = 2.0 * np.pi / wavelength
        # sixth roots as cbrt(sqrt(·)) and the 12/5 power as exp(1.2·ln), as link-core does: numpy's
        # power costs several times more than its cbrt, sqrt, exp and log
        rytov = 1.23 * c["atmosphere.cn2"] * k * length * length * np.cbrt(np.sqrt(k / length))
        weak = 1.33 * rytov * lam / np.cbrt(np.sqrt(lam))
        spread = weak * np.cbrt(np.sqrt(1.0 + STRONG_OVER_WEAK_SIXTH * np.exp(1.2 * np.log(rytov)) * lam))
        w = w * np.sqrt(1.0 + spread)
    outer = c["receiver.apertureDiameterM"] / 2.0
    inner = outer * c["receiver.obscurationRatio"]
    jitter = c["pointing.jitterSigmaPerAxisRad"] * length
    bias = c["pointing.staticErrorRad"] * length
    s2 = 0.25 * w * w + jitter * jitter
    noncentrality = bias * bias / s2
    # E[C] = P(b < |Y| ≤ a), Y ~ N(ν, s²I): a difference of ncx2 CDFs with 2 degrees of freedom
    mean = stats.ncx2.cdf(outer * outer / s2, 2, noncentrality)
    obscured = inner > 0
    if obscured.any():
        mean[obscured] -= stats.ncx2.cdf((inner * inner / s2)[obscured], 2, noncentrality[obscured])
    return -DB * np.log(mean)


def margins(c, job, weather=True):
    """The link margin [dB] (METHODS.md §10.1); without weather, the clear-air margin (§11.1)."""
    atmospheric = 0.0
    if weather:
        v_km = c["atmosphere.visibilityM"] * (MOR_TO_2_PERCENT if job["morInput"] else 1.0) / 1000.0
        atmospheric = attenuation_db_per_km(job["kruse"], v_km, c["transmitter.wavelengthM"]) * c["rangeM"] / 1000.0
    return (c["transmitter.powerDbm"] - c["transmitter.opticsLossDb"] - capture_and_pointing_loss_db(c, job["gaussianBeam"]) - atmospheric
            - c["receiver.opticsLossDb"] - c["receiver.sensitivityDbm"] - c["systemMarginDb"])


def availability(design, records, job):
    """METHODS.md §11.3 over the records, vectorised: one root for V_min, then array comparisons."""
    job = {"kruse": job["availabilityKruse"], "gaussianBeam": job["availabilityGaussianBeam"], "recordsMor": job["recordsMor"], "morInput": False}
    clear_air = float(margins({name: np.array([value]) for name, value in design.items()}, job, weather=False)[0])
    length_km = design["rangeM"] / 1000.0
    allowed = clear_air / length_km  # the largest tolerable specific attenuation [dB/km]
    wavelength = np.array([design["transmitter.wavelengthM"]])
    gamma = lambda log_v: float(attenuation_db_per_km(job["kruse"], np.array([10.0 ** log_v]), wavelength)[0]) - allowed
    threshold_km = 10.0 ** optimize.brentq(gamma, -3.0, 3.0, xtol=1e-15) if allowed > 0 else math.inf
    visibility, stamps = records
    v_km = visibility * (MOR_TO_2_PERCENT if job["recordsMor"] else 1.0) / 1000.0
    usable = (visibility > 0) & np.isfinite(visibility)
    step_h = np.diff(stamps) / 3_600_000.0
    contiguous = np.append(step_h <= 3.0, True)
    duration = np.where(contiguous, np.append(step_h, 1.0), 1.0)
    down = usable & (v_km < threshold_km)
    covered = duration[usable].sum()
    availability_fraction = (covered - duration[down].sum()) / covered
    # an outage starts at a down record whose predecessor was not down and contiguous
    carried = np.append(False, (down & contiguous)[:-1])
    starts = down & ~carried
    run = np.cumsum(starts)
    longest = np.bincount(run[down], weights=duration[down]).max() if down.any() else 0.0
    worst = clear_air - float(attenuation_db_per_km(job["kruse"], np.array([v_km[usable].min()]), wavelength)[0]) * length_km
    return availability_fraction, int(starts.sum()), float(longest), worst


def warm_median(work, passes):
    work()  # warm-up: page faults of the temporaries, scipy's first-call set-up
    timings = []
    for _ in range(passes):
        start = time.process_time()
        result = work()
        timings.append(time.process_time() - start)
    timings.sort()
    return result, timings


def main():
    folder = sys.argv[1]
    with open(os.path.join(folder, "job.json")) as handle:
        job = json.load(handle)
    count = job["count"]
    raw = np.fromfile(os.path.join(folder, "columns.f64"), dtype="<f8")
    columns = {name: raw[i * count:(i + 1) * count] for i, name in enumerate(job["fields"])}
    result, timings = warm_median(lambda: margins(columns, job), job["passes"])
    result.astype("<f8").tofile(os.path.join(folder, "margins.f64"))
    report = {"budgetSeconds": timings, "count": count}
    if "recordsCount" in job:
        raw_records = np.fromfile(os.path.join(folder, "records.f64"), dtype="<f8")
        records = (raw_records[:job["recordsCount"]], raw_records[job["recordsCount"]:])
        outcome, record_timings = warm_median(lambda: availability(job["availabilityDesign"], records, job), job["availabilityPasses"])
        report.update(availabilitySeconds=record_timings, availability=outcome[0], outageCount=outcome[1], longestOutageH=outcome[2], worstMarginDb=outcome[3])
    report.update(numpy=np.__version__)
    print(json.dumps(report))


if __name__ == "__main__":
    main()
