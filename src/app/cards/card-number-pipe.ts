import { Pipe, PipeTransform } from '@angular/core';

/**
 * A card figure as printed: fixed decimals, thousands grouped with a thin comma, and an en dash
 * for a figure the data cannot give. Never "NaN": anything not a finite number prints the dash.
 */
export function cardNumber(value: number | null | undefined, decimals = 0): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '–';
  const fixed = (Math.round(value * 10 ** decimals) / 10 ** decimals + 0).toFixed(decimals);
  const [whole, fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return fraction === undefined ? grouped : `${grouped}.${fraction}`;
}

@Pipe({ name: 'cardNumber' })
export class CardNumberPipe implements PipeTransform {
  transform(value: number | null | undefined, decimals = 0): string {
    return cardNumber(value, decimals);
  }
}
