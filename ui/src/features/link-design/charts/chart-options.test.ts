import { describe, expect, it } from 'vitest';
import { beamEnvelope, evaluateLink, marginVsRange } from '@beamwright/link-core';
import { beamEnvelopeOption, marginVsRangeOption, waterfallSteps } from '@/features/link-design/charts/chart-options';
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
