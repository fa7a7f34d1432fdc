import { describe, expect, it } from 'vitest';
import { previewCsvText, readCsvPreview, splitCsvLine } from '@/features/weather/csv-preview';

describe('the preview of a weather file', () => {
  it('splits cells on the delimiter outside quotes, with doubled quotes inside', () => {
    expect(splitCsvLine('a,"b, c","say ""hi""",', ',')).toEqual(['a', 'b, c', 'say "hi"', '']);
    expect(splitCsvLine('2024-01-01;1500', ';')).toEqual(['2024-01-01', '1500']);
  });

  it('reads the header and first rows with their lines, and guesses the columns', () => {
    const preview = previewCsvText('\uFEFFtime;vis_km;rain\n2024-01-01T00:00Z;12.5;0\n\n2024-01-01T01:00Z;0.3;1.2\n2024-01-01T02:00Z;0.2;');
    expect(preview.delimiter).toBe(';');
    expect(preview.header).toEqual(['time', 'vis_km', 'rain']);
    // the last line may be cut by the preview window, so it is left out
    expect(preview.rows).toEqual([
      { line: 2, cells: ['2024-01-01T00:00Z', '12.5', '0'] },
      { line: 4, cells: ['2024-01-01T01:00Z', '0.3', '1.2'] },
    ]);
    expect(preview.guess).toMatchObject({ timestampColumn: 'time', visibilityColumn: 'vis_km', visibilityUnit: 'km', visibilityDefinition: 'mor-5-percent', rainRateColumn: 'rain' });
  });

  it('reads a small file whole, and refuses binary content', async () => {
    const small = await readCsvPreview(new Blob(['time,visibility_m\n2024-01-01T00:00Z,900']));
    expect(small.rows).toEqual([{ line: 2, cells: ['2024-01-01T00:00Z', '900'] }]);
    await expect(readCsvPreview(new Blob([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01])]))).rejects.toThrow(/binary data/);
  });
});
