// The product's colours (tailwind.config.ts) for drawing in the PDF.
export const PDF_COLOURS = {
  ink: '#1d2430',
  soft: '#4a5261',
  faint: '#7b8190',
  rule: '#d9d3c5',
  sunk: '#efebe2',
  cost: '#16607a',
  costLight: '#d7e9ef',
  time: '#7a3f86',
  caution: '#b7791f',
  cautionDark: '#7c5212',
  cautionLight: '#fbf0d9',
} as const;
