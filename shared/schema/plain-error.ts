/**
 * An API error told to a person: the field's label instead of its JSON pointer, and no pointers
 * to developer documents. The API answer keeps the pointer (`issues[].path`); screens show these
 * words. Labels come from the screen that sent the request (the form's own labels); a field without
 * one is named from its pointer ("/wells/3/rate_m3_s" → "well 4, rate").
 */

/** The error part of an API answer (`{ error: { … } }`). */
export interface ErrorBodyLike {
  code?: string;
  message?: string;
  fix?: string;
  issues?: ReadonlyArray<{ path: string; message: string }>;
}

/** Unit suffixes of field names (`level_m`, `rate_m3_s`), dropped from the spoken name. */
const UNIT_SUFFIX = /_(m3_s|m2_s|m_s|m2_kN|m|s|kPa|kN_m3|deg|kW|kWh|m3|per_m3|per_kWh)$/;

const SINGULAR: Record<string, string> = {
  wells: 'well', excavations: 'excavation', piezometers: 'piezometer', boundaries: 'boundary', layers: 'layer', outline: 'corner', schedule: 'step',
  controlPoints: 'control point', stages: 'stage', readings: 'reading', points: 'point', receptors: 'receptor', coordinates: 'point',
};

/** Field names whose words are a symbol rather than a phrase. */
const TERMS: Record<string, string> = { mv_m2_kN: 'coefficient of volume compressibility m_v' };

function words(name: string): string {
  if (TERMS[name]) return TERMS[name];
  return name.replace(UNIT_SUFFIX, '').replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/_/g, ' ').toLowerCase();
}

/** A validation issue told to a person: the field's label, then what is wrong (the pointer stays for the API and a tooltip). */
export function describeIssuePlainly(issue: { path: string; message: string }): string {
  return `${capital(fieldLabelFromPointer(issue.path))}: ${plainWords(issue.message.replace(POINTER_AT_START, ''))}`;
}

/** A field's name in words, from its JSON pointer ("/wells/3/rate_m3_s" → "well 4, rate"). */
export function fieldLabelFromPointer(pointer: string): string {
  const tokens = pointer.split('/').slice(1).map((t) => t.replace(/~1/g, '/').replace(/~0/g, '~'));
  const parts: string[] = [];
  tokens.forEach((t, i) => {
    if (/^\d+$/.test(t)) {
      const prev = tokens[i - 1] ?? '';
      const label = `${SINGULAR[prev] ?? words(prev)} ${Number(t) + 1}`;
      if (parts.length && parts[parts.length - 1] === words(prev)) parts[parts.length - 1] = label;
      else parts.push(label);
    } else parts.push(words(t));
  });
  return parts.filter(Boolean).join(', ') || 'the request';
}

const POINTER_AT_START = /^(\/[A-Za-z0-9_~.\-/]*)\s*:?\s*/;

function labelOf(pointer: string, labels: Readonly<Record<string, string>>): string {
  return capital(labels[pointer] ?? fieldLabelFromPointer(pointer));
}

/** Sentences of a fix line a person can act on (none that send them to API documents). */
function plainFix(fix: string | undefined): string {
  if (!fix) return '';
  return fix
    .split(/(?<=[.;])\s+/)
    .map((s) => s.replace(/;?\s*see \/api\/v1\/\S+?\.?$/i, '').replace(/the field named in the message/gi, 'it'))
    .filter((s) => s.trim() !== '' && !/\/api\/v1\//.test(s))
    .map((s) => s.replace(/[;,]\s*$/, '.'))
    .join(' ')
    .trim();
}

/** Schema words a person need not know: "must be <= 20000" → "must be at most 20000". */
function plainWords(message: string): string {
  return message
    .replace(/must be <= /g, 'must be at most ')
    .replace(/must be >= /g, 'must be at least ')
    .replace(/must be < /g, 'must be less than ')
    .replace(/must be > /g, 'must be more than ');
}

const sentence = (s: string) => (s === '' ? '' : s + (/[.!?]$/.test(s) ? '' : '.'));
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * The error in plain words: each named field as "Label: what is wrong", then what to do.
 * `labels` maps JSON pointers to the labels the user sees (e.g. `{ '/level_m': 'Level' }`).
 */
export function describeErrorPlainly(error: ErrorBodyLike, labels: Readonly<Record<string, string>> = {}): string {
  const issues = (error.issues ?? []).filter((i) => i.path && i.path !== '/token');
  let body: string;
  if (issues.length > 0) {
    body = issues
      .slice(0, 3)
      .map((i) => sentence(`${labelOf(i.path, labels)}: ${plainWords(i.message.replace(POINTER_AT_START, ''))}`))
      .join(' ');
    if (issues.length > 3) body += ` (and ${issues.length - 3} more)`;
  } else {
    const message = error.message ?? '';
    const m = POINTER_AT_START.exec(message);
    body = sentence(m && m[1] !== '/' ? `${labelOf(m[1]!, labels)}: ${plainWords(message.slice(m[0].length))}` : plainWords(message));
  }
  return [body, plainFix(error.fix)].filter(Boolean).join(' ');
}
