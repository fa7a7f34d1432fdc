import { describe, expect, it } from 'vitest';
import {
  availabilityRangeOption,
  availabilityRangeTable,
  marginDistributionTable,
  monthlyAvailabilityOption,
  monthlyAvailabilityTable,
} from '@/features/weather/charts/availability-charts';

const months = [
  { month: 1, availability: 0.99, coveredHours: 744, unavailableHours: 7.44 },
  { month: 4, availability: 0.97, coveredHours: 720, unavailableHours: 21.6 },
];

describe('availability charts and their tables', () => {
  it('plot the months and list the same months in the table', () => {
    const option = monthlyAvailabilityOption(months, 'light') as { xAxis: { data: string[] }; series: { data: number[] }[]; yAxis: { min: number } };
    expect(option.xAxis.data).toEqual(['Jan', 'Apr']);
    expect(option.series[0]!.data).toEqual([99, 97]);
    expect(option.yAxis.min).toBe(95);
    expect(monthlyAvailabilityTable(months).rows).toEqual([
      ['January', 99, 744, 7.44],
      ['April', 97, 720, 21.6],
    ]);
  });

  it('plot availability against path length in km with the target lines, as the table lists it', () => {
    const points = [
      { rangeM: 500, availability: 0.9999 },
      { rangeM: 1500, availability: 0.995 },
      { rangeM: 3000, availability: null },
    ];
    const option = availabilityRangeOption(points, [{ targetAvailability: 0.99, rangeM: 2000 }], 1500, 'dark') as {
      series: { data: [number, number][]; markLine: { data: { yAxis?: number; xAxis?: number }[] } }[];
    };
    expect(option.series[0]!.data).toEqual([
      [0.5, 99.99],
      [1.5, 99.5],
    ]);
    expect(option.series[0]!.markLine.data).toEqual(expect.arrayContaining([expect.objectContaining({ yAxis: 99 }), expect.objectContaining({ xAxis: 1.5 })]));
    expect(availabilityRangeTable(points).rows).toEqual([
      [0.5, 99.99],
      [1.5, 99.5],
      [3, '—'],
    ]);
  });

  it('tabulate the margin bins with the hours below the floor first', () => {
    const table = marginDistributionTable({ binWidthDb: 2, floorDb: -30, belowHours: 10, bins: [{ lowerDb: -30, upperDb: -28, hours: 30 }], exceeded: [] }, 100);
    expect(table.rows).toEqual([
      ['below \u221230', '\u221230', 10, 10],
      [-30, -28, 30, 30],
    ]);
  });
});
