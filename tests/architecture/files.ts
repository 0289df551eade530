/** The TypeScript sources the architecture tests read (declaration files left out). */
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

export function tsFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...tsFiles(p));
    else if (name.endsWith('.ts') && !name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}
