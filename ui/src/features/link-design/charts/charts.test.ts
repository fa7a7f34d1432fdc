import { describe, expect, it } from 'vitest';
import { beamEnvelope, evaluateLink, marginVsRange } from '@beamwright/link-core';
import { beamEnvelopeData, beamEnvelopeOption, LONG_TERM_RADIUS_NAME } from '@/features/link-design/charts/beam-envelope-chart';
import { marginVsRangeOption } from '@/features/link-design/charts/margin-charts';
import { waterfallSteps } from '@/features/link-design/charts/waterfall-chart';
import { workedExampleDesign } from '@/testing/designs';

describe('chart options', () => {
  it('walks the waterfall from the transmit power down to a margin bar that spans exactly the link margin', () => {
    const budget = evaluateLink(workedExampleDesign);
    const { steps, sensitivityDbm } = waterfallSteps(budget);
    expect(steps[0]).toMatchObject({ name: 'Tx power', high: 20 });
    expect(sensitivityDbm).toBe(-36);
    const received = steps.find((step) => step.name === 'Received')!;
    expect(received.high).toBeCloseTo(budget.receivedPowerDbm, 9);
    const margin = steps.at(-1)!;
    expect(margin.kind).toBe('margin-good');
    expect(margin.high - margin.low).toBeCloseTo(budget.linkMarginDb, 9);
  });

  it('marks a failing margin differently from a good one (not by colour alone: a dashed border)', () => {
    const budget = evaluateLink({ ...workedExampleDesign, rangeM: 6000 });
    expect(budget.linkMarginDb).toBeLessThan(0);
    const { steps } = waterfallSteps(budget);
    expect(steps.at(-1)!.kind).toBe('margin-poor');
  });

  it('keeps the receive aperture inside the beam chart even when it is wider than the beam', () => {
    const design = { ...workedExampleDesign, transmitter: { ...workedExampleDesign.transmitter, halfAngleDivergenceRad: undefined }, receiver: { ...workedExampleDesign.receiver, apertureDiameterM: 0.2 } };
    const option = beamEnvelopeOption(beamEnvelope(design), 'light') as { yAxis: { max: number } };
    expect(option.yAxis.max).toBeGreaterThanOrEqual(100); // mm: the 100 mm aperture radius fits
  });

  it('plots the long-term radius of the Gaussian-beam model as its own named series, and lists it in the table from the same points', () => {
    // a narrow collimated beam over 3 km, Cn² = 1e-14, Gaussian-beam model
    const narrow = {
      ...workedExampleDesign,
      rangeM: 3000,
      transmitter: { ...workedExampleDesign.transmitter, waistRadiusM: 0.005, halfAngleDivergenceRad: undefined },
      atmosphere: { ...workedExampleDesign.atmosphere, cn2: 1e-14, turbulenceModel: 'gaussian-beam' as const },
    };
    const envelope = beamEnvelope(narrow, { points: 21 });
    const option = beamEnvelopeOption(envelope, 'light') as {
      legend: { data: string[] };
      series: { name: string; data: [number, number][]; lineStyle: { type?: string } }[];
    };
    expect(option.legend.data).toEqual(['Beam radius', LONG_TERM_RADIUS_NAME]);
    const longTerm = option.series.find((series) => series.name === LONG_TERM_RADIUS_NAME)!;
    expect(longTerm.lineStyle.type).toBe('dashed'); // not told by colour alone
    // mm on the axis; the last point is the budget's long-term radius at the receiver
    const budget = evaluateLink(narrow);
    expect(longTerm.data.at(-1)![0]).toBe(3);
    expect(longTerm.data.at(-1)![1]).toBeCloseTo(budget.longTermBeamRadiusM! * 1e3, 9);
    expect(longTerm.data.at(-1)![1]).toBeGreaterThan(budget.beamRadiusAtReceiverM * 1e3);

    const table = beamEnvelopeData(envelope);
    expect(table.columns).toEqual(['Distance from the transmitter (km)', 'Beam 1/e² radius (mm)', 'Long-term 1/e² radius in turbulence (mm)']);
    const beam = option.series.find((series) => series.name === 'Beam radius')!;
    expect(table.rows).toEqual(beam.data.map(([distance, radius], index) => [distance, radius, longTerm.data[index]![1]]));
  });

  it('draws no long-term radius for the spherical-wave model or without turbulence', () => {
    for (const atmosphere of [
      { ...workedExampleDesign.atmosphere, turbulenceModel: 'spherical-wave' as const },
      { ...workedExampleDesign.atmosphere, cn2: 0, turbulenceModel: 'gaussian-beam' as const },
    ]) {
      const envelope = beamEnvelope({ ...workedExampleDesign, atmosphere });
      const option = beamEnvelopeOption(envelope, 'light') as { legend?: unknown; series: { name: string }[] };
      expect(option.legend).toBeUndefined();
      expect(option.series.map((series) => series.name)).toEqual(['Beam radius', 'Beam radius (lower edge)']);
      expect(beamEnvelopeData(envelope).columns).toHaveLength(2);
    }
  });

  it('marks the design range and the zero-margin line on the margin-against-range chart', () => {
    const option = marginVsRangeOption(marginVsRange(workedExampleDesign), 2000, 3, 'light') as {
      series: { markLine: { data: Record<string, unknown>[] } }[];
    };
    const marks = option.series[0]!.markLine.data;
    // the shaded failing band runs from the bottom of the axis up to 0 dB, never above it
    const typed = option as unknown as { yAxis: { min: number }; series: { markArea: { data: [{ yAxis: number }, { yAxis: number }][] } }[] };
    expect(typed.series[0]!.markArea.data[0]).toEqual([{ yAxis: typed.yAxis.min }, { yAxis: 0 }]);
    expect(typed.yAxis.min).toBeLessThan(0);
    expect(marks).toEqual(expect.arrayContaining([expect.objectContaining({ yAxis: 0 }), expect.objectContaining({ yAxis: 3 }), expect.objectContaining({ xAxis: 2 })]));
  });

  it('ends the path-length axis on the sweep\'s last range written cleanly (1.9 km × 2 = 3.8 km, not 3.8000000000000003)', () => {
    const design = { ...workedExampleDesign, rangeM: 1900 };
    const option = marginVsRangeOption(marginVsRange(design), 1900, 3, 'light') as { xAxis: { max: number } };
    expect(option.xAxis.max).toBe(3.8);
  });
});
