// Games' shared words, without zod: the web app's screens import these, and the schemas in games.ts are built
// on them.
export const gameKinds = ['pinball', 'video', 'jukebox', 'darts', 'other'] as const;
export const gameKindLabels: Record<(typeof gameKinds)[number], string> = {
  pinball: 'Pinball',
  video: 'Video / arcade',
  jukebox: 'Jukebox',
  darts: 'Darts',
  other: 'Other',
};
// Our own status words; each is shown with a word and an icon, never colour alone.
export const gameStatuses = ['running', 'attention', 'down', 'in_shop'] as const;
export type GameStatus = (typeof gameStatuses)[number];
export const gameStatusLabels: Record<GameStatus, string> = {
  running: 'Running',
  attention: 'Needs attention',
  down: 'Down',
  in_shop: 'At the shop',
};
