// How each technician's route is told apart on the dispatcher's map and in their column: a letter, a colour, a
// line pattern and a marker shape — never colour alone. Colours are our own, kept clear of the running /
// attention / down colours, and dark enough for white numbers and for lines on a pale ground (≥ 4.5:1 on white).

export interface RouteStyle {
  /** "A", "B", …: on every marker ("A3" = A's third stop) and beside the name. */
  letter: string;
  colour: string;
  /** Leaflet/SVG stroke-dasharray; '' = solid. */
  dash: string;
  /** Words for the pattern, for the legend's screen-reader text. */
  patternName: string;
  shape: 'circle' | 'square' | 'diamond';
}

const colours = ['#1d4ed8', '#6d28d9', '#0f766e', '#9d174d', '#78350f', '#334155'];
const patterns: { dash: string; name: string }[] = [
  { dash: '', name: 'solid line' },
  { dash: '12 8', name: 'dashed line' },
  { dash: '2 7', name: 'dotted line' },
  { dash: '14 6 2 6', name: 'dash-dot line' },
];
const shapes: RouteStyle['shape'][] = ['circle', 'square', 'diamond'];

export function routeStyle(index: number): RouteStyle {
  const letter =
    index < 26 ? String.fromCharCode(65 + index) : `${String.fromCharCode(65 + (Math.floor(index / 26) % 26))}${(index % 26) + 1}`;
  const pattern = patterns[index % patterns.length]!;
  return {
    letter,
    colour: colours[index % colours.length]!,
    dash: pattern.dash,
    patternName: pattern.name,
    shape: shapes[index % shapes.length]!,
  };
}
