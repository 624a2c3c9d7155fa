const useColour = process.stdout.isTTY === true && !process.env.NO_COLOR;

function paint(code: number): (text: string) => string {
  return (text) => (useColour ? `\x1b[${code}m${text}\x1b[0m` : text);
}

export const colour = {
  bold: paint(1),
  dim: paint(2),
  red: paint(31),
  green: paint(32),
  yellow: paint(33),
  blue: paint(34),
  magenta: paint(35),
  cyan: paint(36),
};

/** Distinct colours for the log prefixes of the services, in start order. */
export const prefixColours = [colour.magenta, colour.yellow, colour.cyan, colour.blue, colour.green];

export function formatDuration(ms: number): string {
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(1)} s`;
  const minutes = Math.floor(ms / 60_000);
  const seconds = Math.round((ms % 60_000) / 1000);
  return `${minutes} min ${seconds} s`;
}

export function heading(text: string): void {
  console.log(`\n${colour.bold(colour.cyan('▶'))} ${colour.bold(text)}`);
}

export function note(text: string): void {
  console.log(`  ${text}`);
}

export function success(text: string): void {
  console.log(`${colour.green('✔')} ${text}`);
}

export function failure(text: string): void {
  console.log(`${colour.red('✘')} ${text}`);
}

export function warning(text: string): void {
  console.log(`${colour.yellow('!')} ${text}`);
}
