import { Pipe, PipeTransform } from '@angular/core';
import { cardNumber } from '@shared/card/card-presentation';

export { cardNumber };

@Pipe({ name: 'cardNumber' })
export class CardNumberPipe implements PipeTransform {
  transform(value: number | null | undefined, decimals = 0): string {
    return cardNumber(value, decimals);
  }
}
