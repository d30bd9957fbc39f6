import { effect, signal, untracked, type Signal } from '@angular/core';
import type { Observable } from 'rxjs';
import { requestState } from './request-state';

/** The record a page's address names, as the page reads it. */
export interface AddressedRecord<T> {
  /** The record as last loaded; null before the first answer. */
  readonly value: Signal<T | null>;
  readonly loading: Signal<boolean>;
  /** The sentence of a failed load, or of an address that names no record. */
  readonly problem: Signal<string | null>;
  /** Loads the record again (the page's "Try again", or after an action changed it). */
  reload(): void;
}

/**
 * Loads the record whose id the page's address gives (a routed input, NaN when the address has
 * none that parses) each time the id changes, through `load`; an id that is not a number asks
 * nobody and says `notNamed`. Create it in an injection context; its requests end with the page.
 */
export function addressedRecord<T>(id: Signal<number>, load: (id: number) => Observable<T>, notNamed: string): AddressedRecord<T> {
  const request = requestState();
  const value = signal<T | null>(null);
  const fetch = (current: number): void => {
    if (!Number.isFinite(current)) request.showProblem(notNamed);
    else request.run(load(current), (answer) => value.set(answer));
  };
  effect(() => {
    const current = id();
    untracked(() => fetch(current));
  });
  return { value: value.asReadonly(), loading: request.busy, problem: request.problem, reload: () => fetch(untracked(id)) };
}
