/** Screen colours for the ten conductor colours of the 25-pair code; the name is always shown beside them. */
const SCREEN: Record<string, string> = {
  white: '#ffffff',
  red: '#d32f2f',
  black: '#1b1b1b',
  yellow: '#f5d000',
  violet: '#7b3fa0',
  blue: '#1e63c6',
  orange: '#f08a00',
  green: '#2e9b45',
  brown: '#7a4a1e',
  slate: '#6f7f8f',
};

export function screenColour(name: string): string {
  return SCREEN[name.toLowerCase()] ?? '#cccccc';
}
