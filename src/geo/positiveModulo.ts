/** `value` modulo `modulus`, in [0, modulus) also for negative values (JavaScript's % keeps the sign). */
export function positiveModulo(value: number, modulus: number): number {
  const result = value % modulus;
  return result < 0 ? result + modulus : result;
}
