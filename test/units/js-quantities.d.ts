/**
 * The small part of js-quantities 1.8.0 (an untyped CommonJS package, devDependency for the
 * cross-check test) that test/units/cross-check.test.ts uses.
 */
declare module 'js-quantities' {
  interface Quantity {
    readonly scalar: number;
    to(unit: string): Quantity;
    toBase(): Quantity;
    units(): string;
  }
  interface QtyFactory {
    (text: string): Quantity;
    (value: number, unit: string): Quantity;
  }
  const Qty: QtyFactory;
  export default Qty;
}
