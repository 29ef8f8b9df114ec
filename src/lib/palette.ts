// Lobewise's palette, defined once. tailwind.config.ts turns it into theme tokens for class names;
// canvas drawing (charts) reads the same values here. Never write a hex value anywhere else.
export const palette = {
  ink: { DEFAULT: '#1c1f24', soft: '#3a3f47', muted: '#5d6470' },
  paper: { DEFAULT: '#f6f4ef', raised: '#ffffff', sunk: '#ebe7de' },
  steel: { 100: '#e3e6ea', 300: '#b9bfc8', 500: '#7c8593', 700: '#4a515c', 900: '#23272e' },
  // ember-500 carries white button text: #b34d16 gives 5.3:1 on it (WCAG AA needs 4.5:1; the first #c8561b
  // gave 4.4:1 and axe failed every primary button). 600 is its hover and a text colour on paper (6.6:1).
  ember: { 100: '#fbe6d6', 500: '#b34d16', 600: '#983f0d', 700: '#84370b' },
  gauge: { 100: '#dcecef', 500: '#2f7c8a', 700: '#1f5661' },
  ok: { 100: '#dff0e0', 700: '#2d6a33' },
  caution: { 100: '#fbf0cf', 700: '#7a5a00' },
  fault: { 100: '#f8dcdc', 700: '#9b2226' },
} as const;
