// The design inputs as the form shows them: label, section, the kind of quantity typed, the unit a
// plain number is read in, and how a stored SI value is written back as text. Field ids are the
// paths of LinkDesignSchema, so the schema's issues land on the right field.

export type QuantityKind = 'length' | 'angle' | 'power' | 'decibel' | 'fraction' | 'dimensionless' | 'structureConstant';

export type DesignSection = 'path' | 'transmitter' | 'receiver' | 'pointing' | 'atmosphere' | 'allowances';

export interface QuantityField {
  id: QuantityFieldId;
  label: string;
  section: DesignSection;
  kind: QuantityKind;
  /** unit of a plain number and of the text written from a stored value ('' for none) */
  unit: string;
  /** true when the field may be left blank */
  optional?: boolean;
  /** an example of what to type */
  example: string;
  /** why the field matters, one line */
  hint?: string;
}

export const QUANTITY_FIELD_IDS = [
  'rangeM',
  'transmitter.wavelengthM',
  'transmitter.powerDbm',
  'transmitter.waistRadiusM',
  'transmitter.halfAngleDivergenceRad',
  'transmitter.m2',
  'transmitter.opticsLossDb',
  'receiver.apertureDiameterM',
  'receiver.obscurationRatio',
  'receiver.sensitivityDbm',
  'receiver.overloadDbm',
  'receiver.opticsLossDb',
  'receiver.fieldOfViewRad',
  'pointing.jitterSigmaPerAxisRad',
  'pointing.staticErrorRad',
  'pointing.outageProbability',
  'atmosphere.visibilityM',
  'atmosphere.cn2',
  'scintillation.probability',
  'systemMarginDb',
] as const;
export type QuantityFieldId = (typeof QUANTITY_FIELD_IDS)[number];

const fields: QuantityField[] = [
  { id: 'rangeM', label: 'Path length', section: 'path', kind: 'length', unit: 'km', example: '2 km or 850 m' },
  { id: 'transmitter.wavelengthM', label: 'Wavelength', section: 'transmitter', kind: 'length', unit: 'nm', example: '1550 nm or 1.55 µm' },
  {
    id: 'transmitter.powerDbm',
    label: 'Transmit power',
    section: 'transmitter',
    kind: 'power',
    unit: 'dBm',
    example: '17 dBm or 50 mW',
    hint: 'Mean optical power leaving the terminal.',
  },
  {
    id: 'transmitter.waistRadiusM',
    label: 'Beam size at the aperture',
    section: 'transmitter',
    kind: 'length',
    unit: 'mm',
    example: '25 mm',
  },
  {
    id: 'transmitter.halfAngleDivergenceRad',
    label: 'Beam divergence',
    section: 'transmitter',
    kind: 'angle',
    unit: 'mrad',
    optional: true,
    example: '0.9 mrad',
    hint: 'Leave blank for a collimated, diffraction-limited beam.',
  },
  { id: 'transmitter.m2', label: 'Beam quality M²', section: 'transmitter', kind: 'dimensionless', unit: '', example: '1.2' },
  { id: 'transmitter.opticsLossDb', label: 'Transmit optics loss', section: 'transmitter', kind: 'decibel', unit: 'dB', example: '1.5 dB' },
  { id: 'receiver.apertureDiameterM', label: 'Receive aperture diameter', section: 'receiver', kind: 'length', unit: 'mm', example: '100 mm' },
  {
    id: 'receiver.obscurationRatio',
    label: 'Central obscuration',
    section: 'receiver',
    kind: 'dimensionless',
    unit: '',
    example: '0.25',
    hint: 'Secondary-mirror diameter over aperture diameter; 0 for a lens.',
  },
  { id: 'receiver.sensitivityDbm', label: 'Receiver sensitivity', section: 'receiver', kind: 'power', unit: 'dBm', example: '−36 dBm' },
  {
    id: 'receiver.overloadDbm',
    label: 'Receiver overload',
    section: 'receiver',
    kind: 'power',
    unit: 'dBm',
    optional: true,
    example: '−3 dBm',
  },
  { id: 'receiver.opticsLossDb', label: 'Receive optics loss', section: 'receiver', kind: 'decibel', unit: 'dB', example: '1.5 dB' },
  {
    id: 'receiver.fieldOfViewRad',
    label: 'Field of view (half angle)',
    section: 'receiver',
    kind: 'angle',
    unit: 'mrad',
    optional: true,
    example: '2 mrad',
  },
  {
    id: 'pointing.jitterSigmaPerAxisRad',
    label: 'Pointing jitter (σ per axis)',
    section: 'pointing',
    kind: 'angle',
    unit: 'µrad',
    example: '50 µrad',
    hint: 'Building sway, thermal bowing and mount vibration, as a standard deviation.',
  },
  {
    id: 'pointing.staticErrorRad',
    label: 'Static pointing error',
    section: 'pointing',
    kind: 'angle',
    unit: 'µrad',
    example: '100 µrad',
    hint: 'Residual misalignment after installation.',
  },
  {
    id: 'pointing.outageProbability',
    label: 'Pointing outage probability',
    section: 'pointing',
    kind: 'fraction',
    unit: '',
    optional: true,
    example: '0.001',
    hint: 'Blank: budget the mean pointing loss. A probability budgets the loss exceeded only that often.',
  },
  { id: 'atmosphere.visibilityM', label: 'Design visibility', section: 'atmosphere', kind: 'length', unit: 'km', example: '5 km' },
  {
    id: 'atmosphere.cn2',
    label: 'Turbulence strength Cn²',
    section: 'atmosphere',
    kind: 'structureConstant',
    unit: '',
    example: '5e-14 (m^-2/3)',
    hint: 'Rooftop paths: about 1e-15 (weak) to 1e-13 (strong) m^-2/3.',
  },
  {
    id: 'scintillation.probability',
    label: 'Fade probability',
    section: 'atmosphere',
    kind: 'fraction',
    unit: '',
    example: '0.001 or 0.1 %',
    hint: 'Share of time the scintillation may take the signal below the margin.',
  },
  {
    id: 'systemMarginDb',
    label: 'Ageing and dirt allowance',
    section: 'allowances',
    kind: 'decibel',
    unit: 'dB',
    example: '2 dB',
    hint: 'Kept in reserve for window dirt and component ageing.',
  },
];

export const QUANTITY_FIELDS: Readonly<Record<QuantityFieldId, QuantityField>> = Object.fromEntries(
  fields.map((field) => [field.id, field]),
) as Record<QuantityFieldId, QuantityField>;

export const SECTION_TITLES: Record<DesignSection, string> = {
  path: 'Path',
  transmitter: 'Transmitter',
  receiver: 'Receiver',
  pointing: 'Pointing',
  atmosphere: 'Weather and turbulence',
  allowances: 'Allowances',
};

export function fieldsOfSection(section: DesignSection): QuantityField[] {
  return fields.filter((field) => field.section === section);
}

/** Labels of the choice fields (not typed quantities), for diffs and read-only views. */
export const CHOICE_FIELD_LABELS: Record<string, string> = {
  'atmosphere.model': 'Visibility model',
  'atmosphere.visibilityDefinition': 'Visibility definition',
  'atmosphere.turbulenceModel': 'Turbulence model',
  'scintillation.include': 'Scintillation fade margin',
};

export const ATMOSPHERE_MODEL_LABELS: Record<string, string> = {
  kim: 'Kim (2001)',
  kruse: 'Kruse (1962)',
  'al-naboulsi-advection': 'Al Naboulsi, advection fog',
  'al-naboulsi-radiation': 'Al Naboulsi, radiation fog',
};

/** The budget's turbulence models, with the one line the workspace shows beside the choice. */
export const TURBULENCE_MODEL_LABELS: Record<string, string> = {
  'gaussian-beam': 'Gaussian beam',
  'spherical-wave': 'Spherical wave (earlier model)',
};

export const VISIBILITY_DEFINITION_LABELS: Record<string, string> = {
  'contrast-2-percent': '2 % contrast (classical)',
  'mor-5-percent': 'MOR, 5 % contrast (airport reports)',
};

/** Width definitions a datasheet may use for the beam size and the divergence. */
export const WIDTH_DEFINITIONS = ['1/e2', '1/e', 'fwhm'] as const;
export type WidthDefinition = (typeof WIDTH_DEFINITIONS)[number];
export const WIDTH_DEFINITION_LABELS: Record<WidthDefinition, string> = {
  '1/e2': '1/e² (13.5 % intensity)',
  '1/e': '1/e (36.8 % intensity)',
  fwhm: 'FWHM (50 % intensity)',
};
