'use client';

import { useId } from 'react';

/** A labelled input whose error is announced and linked with aria-describedby. */
export function Field({
  label,
  error,
  hint,
  ...input
}: { label: string; error?: string; hint?: string } & React.InputHTMLAttributes<HTMLInputElement>) {
  const id = useId();
  const errId = `${id}-err`;
  const hintId = `${id}-hint`;
  const describedBy = [hint ? hintId : '', error ? errId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className="mb-4">
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input id={id} className="field" aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...input} />
      {hint && (
        <p id={hintId} className="mt-1 text-sm text-clay-700">
          {hint}
        </p>
      )}
      {error && (
        <p id={errId} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

/** A polite live region for form results. */
export function Status({ message, tone = 'info' }: { message: string | null; tone?: 'info' | 'error' }) {
  return (
    <p role={tone === 'error' ? 'alert' : 'status'} aria-live="polite" className={`min-h-6 text-sm ${tone === 'error' ? 'font-semibold text-ember-800' : 'text-tide-700'}`}>
      {message ?? ''}
    </p>
  );
}
