import { FormControl, type AbstractControl } from '@angular/forms';

/**
 * Reading a draft's content (which may be incomplete or malformed) into form values and writing
 * form values back as content: the small conversions every part of the revision form shares.
 */
export type Json = Record<string, unknown>;
export type NumberControl = FormControl<number | null>;

export const record = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});
export const list = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);
export const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
export const str = (value: unknown): string => (typeof value === 'string' ? value : '');
export const oneOf = <T extends string>(options: readonly T[], value: unknown): T | null => (options.includes(value as T) ? (value as T) : null);

export const numberControl = (value: number | null = null): NumberControl => new FormControl<number | null>(value);
export const text = (value = '') => new FormControl(value, { nonNullable: true });

/** Null and NaN leave the field out of the content, so the schema says "Give …". */
export const out = (value: number | null): number | undefined => (value === null || Number.isNaN(value) ? undefined : value);

export function withoutUndefined(value: Json): Json {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined));
}

/** Records one field control under the content path the schema reports its problems at. */
export type AddField = (path: string, control: AbstractControl) => void;
