/**
 * Character codes the hand-written scanners compare against (ASCII: the same value as a UTF-16
 * code unit and as a UTF-8 byte).
 */
export const TAB = 9;
export const SPACE = 32;
export const HASH = 35;
export const PLUS = 43;
export const MINUS = 45;
export const DOT = 46;
export const ZERO = 48;
export const NINE = 57;
export const UPPER_E = 69;
export const LOWER_E = 101;
