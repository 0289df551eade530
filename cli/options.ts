/** Small argument parsers shared by command definitions. */
import { InvalidArgumentError } from 'commander';

export function intArg(name: string) {
  return (v: string) => {
    const n = Number(v);
    if (!Number.isInteger(n)) throw new InvalidArgumentError(`${name} must be a whole number, got "${v}"`);
    return n;
  };
}

export function numberArg(name: string) {
  return (v: string) => {
    const n = Number(v);
    if (v.trim() === '' || !Number.isFinite(n)) throw new InvalidArgumentError(`${name} must be a number, got "${v}"`);
    return n;
  };
}
