/** Where a content path points, in words a fleet engineer reads: "Speed VR › reference speed (kt)". */
export const FIELD_WORDS: Readonly<Record<string, string>> = {
  category: 'category',
  engines: 'engines',
  ceilingFt: 'ceiling (ft)',
  minimumKg: 'minimum weight (kg)',
  maximumTakeoffKg: 'maximum takeoff weight (kg)',
  maximumLandingKg: 'maximum landing weight (kg)',
  referenceKg: 'reference weight (kg)',
  iceIncrementKt: 'ice increment (kt)',
  key: 'key',
  label: 'label',
  iasKt: 'IAS (kt)',
  casKt: 'CAS (kt)',
  code: 'code',
  phase: 'phase',
  configurationKey: 'configuration',
  basis: 'basis',
  kind: 'kind',
  referenceKt: 'reference speed (kt)',
  valueKt: 'speed (kt)',
  byWeightKg: 'weights (kg)',
  byPressureAltitudeFt: 'pressure altitudes (ft)',
  byOatC: 'OATs (°C)',
  valuesKt: 'table (kt)',
  vnoKt: 'VNO (kt)',
  vneKt: 'VNE (kt)',
  vmoKt: 'VMO (kt)',
  mmo: 'MMO',
  vleKt: 'VLE (kt)',
  vloKt: 'VLO (kt)',
  vmcKt: 'VMC (kt)',
  vyseKt: 'VYSE (kt)',
  demonstratedCrosswindKt: 'Demonstrated crosswind (kt)',
  maximumTailwindKt: 'Tailwind limit (kt)',
  indicatorMarkingBasis: 'Indicator marking basis',
  notes: 'Notes',
  statedUnits: 'Units of the flight manual',
  weight: 'weights in',
  speed: 'speeds in',
  speedClass: 'class',
  statesReferenceStallSpeeds: 'Envelope › reference stall speeds',
};

type Json = Record<string, unknown>;
const at = (value: unknown, index: string): Json => {
  const item = Array.isArray(value) ? (value[Number(index)] as unknown) : undefined;
  return typeof item === 'object' && item !== null ? (item as Json) : {};
};

export function problemLocation(path: string, content: Json): string {
  const [section, index, field, ...rest] = path.split('.');
  const word = (name: string | undefined) => (name ? (FIELD_WORDS[name] ?? name) : '');
  switch (section) {
    case 'aircraft':
      return `Aircraft › ${word(index)}`;
    case 'weights':
      return `Weights › ${word(index)}`;
    case 'limits':
      return index === 'vfeKt' ? `Limits › VFE of ${field ?? 'a configuration'} (kt)` : `Limits › ${word(index)}`;
    case 'configurations': {
      if (index === undefined) return 'Configurations';
      const c = at(content['configurations'], index);
      const name = typeof c['label'] === 'string' && c['label'] ? c['label'] : `configuration ${Number(index) + 1}`;
      if (field === 'positionError' && rest.length) return `${name} › position-error row ${Number(rest[0]) + 1} › ${word(rest[1])}`.replace(/ › $/, '');
      return `${name} › ${field === 'positionError' ? 'position-error table' : word(field)}`;
    }
    case 'speeds': {
      if (index === undefined) return 'Speeds';
      const s = at(content['speeds'], index);
      const name = typeof s['code'] === 'string' && s['code'] ? `Speed ${s['code']}` : `Speed ${Number(index) + 1}`;
      return `${name} › ${word(field)}`;
    }
    case 'envelope': {
      const bound = rest[0] === 'min' ? 'lowest' : rest[0] === 'max' ? 'highest' : '';
      const axis = field === 'oatC' ? 'OAT (°C)' : field === 'pressureAltitudeFt' ? 'pressure altitude (ft)' : '';
      return ['Envelope', index, [bound, axis].filter(Boolean).join(' ')].filter(Boolean).join(' › ');
    }
    case 'ruleExceptions':
      return index === undefined ? 'Rule exceptions' : `Rule exception ${Number(index) + 1} › ${field === 'ruleId' ? 'rule' : field === 'reason' ? 'flight manual’s reason' : ''}`.replace(/ › $/, '');
    default:
      return word(section) || 'Content';
  }
}
