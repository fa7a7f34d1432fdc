// Number formatting with units and a precision an engineer expects to read, all in one place.
const MINUS = '\u2212';

function fixed(value: number, digits: number): string {
  const text = Math.abs(value).toFixed(digits);
  // "-0.0" reads as a loss that does not exist.
  if (Number(text) === 0) return (0).toFixed(digits);
  return value < 0 ? `${MINUS}${text}` : text;
}

export function formatDb(valueDb: number | null | undefined, options: { digits?: number; signed?: boolean; unit?: 'dB' | 'dBm' } = {}): string {
  if (valueDb === null || valueDb === undefined || !Number.isFinite(valueDb)) return '—';
  const { digits = 1, signed = false, unit = 'dB' } = options;
  const text = fixed(valueDb, digits);
  const sign = signed && Number(text) > 0 ? '+' : '';
  return `${sign}${text} ${unit}`;
}

export function formatDbm(valueDbm: number | null | undefined, digits = 1): string {
  return formatDb(valueDbm, { digits, unit: 'dBm' });
}

/** Ranges: metres below 1 km, kilometres with 2–3 significant decimals above. */
export function formatDistance(valueM: number | null | undefined): string {
  if (valueM === null || valueM === undefined || !Number.isFinite(valueM)) return '—';
  if (valueM === 0) return '0 m';
  if (Math.abs(valueM) < 1000) return `${fixed(valueM, Math.abs(valueM) < 10 ? 2 : 0)} m`;
  const km = valueM / 1000;
  return `${fixed(km, km < 10 ? 3 : 2)} km`;
}

export function formatWavelength(valueM: number | null | undefined): string {
  if (valueM === null || valueM === undefined || !Number.isFinite(valueM)) return '—';
  const nm = valueM * 1e9;
  return `${Number.isInteger(Math.round(nm * 10) / 10) ? nm.toFixed(0) : nm.toFixed(1)} nm`;
}

/** Beam radii and apertures: mm below 1 m, metres with 3 significant figures above. */
export function formatLength(valueM: number | null | undefined): string {
  if (valueM === null || valueM === undefined || !Number.isFinite(valueM)) return '—';
  const abs = Math.abs(valueM);
  if (abs < 1e-3) return `${fixed(valueM * 1e6, 0)} µm`;
  if (abs < 1) return `${fixed(valueM * 1e3, abs < 0.01 ? 2 : 1)} mm`;
  return `${fixed(valueM, abs < 10 ? 3 : 1)} m`;
}

export function formatAngle(valueRad: number | null | undefined): string {
  if (valueRad === null || valueRad === undefined || !Number.isFinite(valueRad)) return '—';
  const abs = Math.abs(valueRad);
  if (abs < 1e-3) return `${fixed(valueRad * 1e6, abs < 1e-5 ? 2 : 1)} µrad`;
  return `${fixed(valueRad * 1e3, 3)} mrad`;
}

export function formatPowerW(valueW: number | null | undefined): string {
  if (valueW === null || valueW === undefined || !Number.isFinite(valueW)) return '—';
  const abs = Math.abs(valueW);
  if (abs >= 1) return `${fixed(valueW, 2)} W`;
  if (abs >= 1e-3) return `${fixed(valueW * 1e3, abs >= 0.1 ? 0 : 1)} mW`;
  return `${fixed(valueW * 1e6, 1)} µW`;
}

export function formatPercent(fraction: number | null | undefined, digits = 1): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '—';
  return `${fixed(fraction * 100, digits)} %`;
}

const absoluteFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const relativeFormat = new Intl.RelativeTimeFormat('en-GB', { numeric: 'auto' });

export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '—' : absoluteFormat.format(date);
}

export function formatRelativeTime(iso: string | null | undefined, now: number = Date.now()): string {
  if (!iso) return '—';
  const time = new Date(iso).getTime();
  if (Number.isNaN(time)) return '—';
  const seconds = Math.round((time - now) / 1000);
  const steps: [Intl.RelativeTimeFormatUnit, number][] = [
    ['second', 60],
    ['minute', 60],
    ['hour', 24],
    ['day', 30],
    ['month', 12],
    ['year', Number.POSITIVE_INFINITY],
  ];
  let amount = seconds;
  for (const [unit, size] of steps) {
    if (Math.abs(amount) < size) return relativeFormat.format(Math.round(amount), unit);
    amount /= size;
  }
  return absoluteFormat.format(new Date(time));
}
