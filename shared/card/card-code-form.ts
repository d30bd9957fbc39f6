/**
 * The form of a card code (alphabet, length, check-character parameters and the stored
 * pattern), which the card API's schemas check. The code's generation, reading and check are
 * the card check's (shared/card-check/card-code.ts, where the method is described).
 */

/** The 23 characters of a card code, in value order (the value of a character is its index). */
export const CARD_CODE_ALPHABET = '23456789ACEFHJKMNPRTWXY';
/** Random characters of a code. */
export const CARD_CODE_RANDOM_LENGTH = 8;
/** Characters of a code, the check character included. */
export const CARD_CODE_LENGTH = CARD_CODE_RANDOM_LENGTH + 1;
/** Modulus and radix of the check character (ISO/IEC 7064 pure system). */
export const CARD_CODE_MODULUS = 23;
export const CARD_CODE_RADIX = 5;

/** A stored card code: exactly 9 characters of the alphabet, the check character last. */
export const CARD_CODE_PATTERN = new RegExp(`^[${CARD_CODE_ALPHABET}]{${CARD_CODE_LENGTH}}$`);
