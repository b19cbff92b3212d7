import type { z } from 'zod';

/** A translator for the `validation` namespace of the message files (next-intl's `t`, or a test stand-in). */
export type Translate = (key: string, values?: Record<string, string | number>) => string;

export interface FormIssues {
  /** Message per field, keyed like the API's `fields` (the issue's path joined with dots, e.g. `lines.0.servings`). */
  fields: Record<string, string>;
  /** The first problem with where it is ("Line 1, Servings: At least 1."), for the form's live region. */
  summary: string;
}

export interface IssueOptions {
  /** Where a path is, in words ("Line 1, Servings"); null leaves the summary without a place. */
  describe?: (path: readonly PropertyKey[]) => string | null;
  /** Messages for a format (pattern) failure, by the last key of the path, e.g. `{ currency: 'Use three letters…' }`. */
  formats?: Record<string, string>;
  /** The values that were checked, to tell an empty field ("Required.") from a wrong one. */
  input?: unknown;
  /**
   * The reader reads the schemas' language (English): show a message the schema wrote itself (it names the
   * quantity and its unit, as the API does), and word only zod's own generic ones.
   */
  schemaLanguage?: boolean;
}

/** zod's built-in English messages (none of the schemas' own starts like these). */
const ZOD_DEFAULT_MESSAGE = /^(Invalid\b|Too (small|big):|Unrecognized key)/;

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let v = input;
  for (const k of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[k];
  }
  return v;
}

const isEmpty = (v: unknown) => v === undefined || v === null || (typeof v === 'string' && v.trim() === '');

/**
 * One zod issue in the user's language. The schemas' own messages are English (the API answers with them);
 * the form words the same rule from the issue's code and bounds, and a refinement names its message key
 * in `params.i18n`.
 */
export function issueMessage(issue: z.core.$ZodIssue, t: Translate, opts: IssueOptions = {}): string {
  if (opts.schemaLanguage && issue.message && !ZOD_DEFAULT_MESSAGE.test(issue.message)) return issue.message;
  const value = valueAt(opts.input, issue.path);
  const last = issue.path[issue.path.length - 1];
  switch (issue.code) {
    case 'invalid_type':
      if (issue.expected === 'int') return t('integer');
      if (issue.expected === 'number') return t('number');
      return t('required');
    case 'too_small': {
      const min = Number(issue.minimum);
      if (issue.origin === 'string') return min <= 1 ? t('required') : t('minLength', { min });
      if (issue.origin === 'array') return t('minItems', { min });
      return issue.inclusive === false ? t('above', { min }) : t('min', { min });
    }
    case 'too_big': {
      const max = Number(issue.maximum);
      if (issue.origin === 'string') return t('maxLength', { max });
      if (issue.origin === 'array') return t('maxItems', { max });
      return issue.inclusive === false ? t('below', { max }) : t('max', { max });
    }
    case 'invalid_format':
      if (isEmpty(value)) return issue.format === 'uuid' ? t('choose') : t('required');
      if (typeof last === 'string' && opts.formats?.[last]) return opts.formats[last];
      if (issue.format === 'email') return t('email');
      if (issue.format === 'uuid') return t('choose');
      return t('format');
    case 'invalid_value':
      return t('choose');
    case 'not_multiple_of':
      return t('integer');
    case 'custom': {
      const key = (issue.params as { i18n?: unknown } | undefined)?.i18n;
      return typeof key === 'string' ? t(`rules.${key}`) : t('invalid');
    }
    default:
      return t('invalid');
  }
}

/** A failed safeParse as the form shows it: one message per field (the first issue wins) and a summary. */
export function formIssues(error: z.ZodError, t: Translate, opts: IssueOptions = {}): FormIssues {
  const fields: Record<string, string> = {};
  let summary = '';
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '';
    const message = issueMessage(issue, t, opts);
    if (key && !(key in fields)) fields[key] = message;
    if (!summary) {
      const where = issue.path.length ? opts.describe?.(issue.path) : null;
      summary = where ? t('at', { where, message }) : message;
    }
  }
  return { fields, summary: summary || t('invalid') };
}
