import fs from 'node:fs';
import path from 'node:path';
import { fromRoot, REPO_ROOT } from './paths.ts';

interface PackageJson {
  name?: string;
  workspaces?: string[];
  scripts?: Record<string, string>;
}

function readPackage(dir: string): PackageJson {
  return JSON.parse(fs.readFileSync(path.join(dir, 'package.json'), 'utf8')) as PackageJson;
}

/** Workspace folders (relative to the root) from the root package.json's `folder/*` patterns. */
export function workspaceDirs(): string[] {
  const patterns = readPackage(REPO_ROOT).workspaces ?? [];
  const dirs: string[] = [];
  for (const pattern of patterns) {
    if (!pattern.endsWith('/*')) throw new Error(`Unsupported workspace pattern "${pattern}" (only "folder/*" is understood)`);
    const parent = pattern.slice(0, -2);
    if (!fs.existsSync(fromRoot(parent))) continue;
    for (const entry of fs.readdirSync(fromRoot(parent), { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
      if (entry.isDirectory() && fs.existsSync(fromRoot(parent, entry.name, 'package.json'))) dirs.push(`${parent}/${entry.name}`);
    }
  }
  return dirs;
}

export function hasScript(dir: string, script: string): boolean {
  return readPackage(fromRoot(dir)).scripts?.[script] !== undefined;
}
