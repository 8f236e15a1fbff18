// Invented names for the scale data: operator companies, game models, people. Metro centres are real
// public map coordinates; every company, venue, person, maker and title is made up.
import { contactFirst, contactLast } from '../demo/scenario.ts';

/** Where a company's route runs: a metro centre and its time zone. */
export const metros = [
  { city: 'Chicago', lat: 41.8781, lon: -87.6298, timeZone: 'America/Chicago', area: '312', zip: '606' },
  { city: 'Milwaukee', lat: 43.0389, lon: -87.9065, timeZone: 'America/Chicago', area: '414', zip: '532' },
  { city: 'Minneapolis', lat: 44.9778, lon: -93.265, timeZone: 'America/Chicago', area: '612', zip: '554' },
  { city: 'St. Louis', lat: 38.627, lon: -90.1994, timeZone: 'America/Chicago', area: '314', zip: '631' },
  { city: 'Detroit', lat: 42.3314, lon: -83.0458, timeZone: 'America/Detroit', area: '313', zip: '482' },
  { city: 'Indianapolis', lat: 39.7684, lon: -86.1581, timeZone: 'America/Indiana/Indianapolis', area: '317', zip: '462' },
  { city: 'Columbus', lat: 39.9612, lon: -82.9988, timeZone: 'America/New_York', area: '614', zip: '432' },
  { city: 'Pittsburgh', lat: 40.4406, lon: -79.9959, timeZone: 'America/New_York', area: '412', zip: '152' },
  { city: 'Denver', lat: 39.7392, lon: -104.9903, timeZone: 'America/Denver', area: '303', zip: '802' },
  { city: 'Portland', lat: 45.5152, lon: -122.6784, timeZone: 'America/Los_Angeles', area: '503', zip: '972' },
] as const;

const companyWords1 = ['Tilt', 'Flipper', 'Bumper', 'Plunger', 'Quarter', 'Joystick', 'Spinner', 'Kickback', 'Slingshot', 'Outlane'];
const companyWords2 = ['Amusements', 'Route Co.', 'Coin-Op', 'Games', 'Music & Games', 'Vending', 'Arcade Services', 'Play Co.'];
const companyPlaces = ['Northgate', 'Riverbend', 'Elm Hollow', 'Lakeside', 'Ironwood', 'Cedar Flats', 'Prairie', 'Harborview', 'Maple Row'];

/** The i-th company's name (the largest is i = 0). */
export function companyName(i: number): string {
  const place = companyPlaces[(i * 7) % companyPlaces.length]!;
  return `${place} ${companyWords1[i % companyWords1.length]} ${companyWords2[(i * 3 + 1) % companyWords2.length]} ${i + 1}`;
}

const makers = [
  'Halloway Amusement',
  'Brightwater Coin',
  'Kestrel Games',
  'Ostrander Music',
  'Bullseye Works',
  'Gantry & Pell',
  'Moravec Play',
];
const titleWords1 = ['Comet', 'Deep Sea', 'Midnight', 'Thunder', 'Lunar', 'Star', 'Turbo', 'Neon', 'Glacier', 'Copper', 'Wild', 'Harbor'];
const titleWords2 = ['Carnival', 'Salvage', 'Rodeo', 'Canyon', 'Orchard', 'Courier', 'Harvest', 'Express', 'Derby', 'Circus', 'Frontier'];
const kindsByMaker = {
  'Halloway Amusement': 'pinball',
  'Brightwater Coin': 'pinball',
  'Kestrel Games': 'video',
  'Ostrander Music': 'jukebox',
  'Bullseye Works': 'darts',
  'Gantry & Pell': 'video',
  'Moravec Play': 'other',
} as const;

export type ModelKind = (typeof kindsByMaker)[keyof typeof kindsByMaker];

/** A catalogue of invented game models; a company owns a slice of it. Unique (maker, title). */
export const modelCatalogue: { maker: string; title: string; kind: ModelKind; year: number }[] = titleWords1.flatMap((w1, i) =>
  titleWords2.map((w2, j) => {
    const maker = makers[(i * 5 + j * 3) % makers.length]!;
    return { maker, title: `${w1} ${w2}`, kind: kindsByMaker[maker as keyof typeof kindsByMaker], year: 1979 + ((i * 11 + j * 7) % 46) };
  }),
);

export const skillsByKind: Record<ModelKind, string[]> = {
  pinball: ['pinball', 'recap', 'power-supply'],
  video: ['video', 'monitor', 'power-supply'],
  jukebox: ['jukebox', 'audio'],
  darts: ['darts', 'boards'],
  other: ['cranes', 'bill-acceptors'],
};

const venueWords1 = ['Copper', 'Lantern', 'Velvet', 'Rusty', 'Blue Heron', 'Third Rail', 'Ember', 'Tin Cup', 'Old Mill', 'Crooked'];
const venueWords2 = ['Stag', 'Foxglove', 'Drumlin', 'Magpie', 'Cobalt', 'Juniper', 'Quarry', 'Kettle', 'Granary', 'Anchor'];
const venueKinds = ['Tap', 'Tavern', 'Lanes', 'Social Club', 'Alehouse', 'Arcade Bar', 'Lounge', 'Pub', 'Bowl', 'Diner', 'Saloon'];

/** The i-th venue's name, distinct over a big route (the demo's list has a few hundred combinations). */
export function venueName(i: number): string {
  const first = i % 2 === 0 ? venueWords1[(i / 2) % venueWords1.length]! : venueWords2[((i - 1) / 2) % venueWords2.length]!;
  return `${first} ${venueKinds[Math.floor(i / 20) % venueKinds.length]}${i >= 220 ? ` ${Math.floor(i / 220) + 1}` : ''}`;
}

/** The i-th person's name, from the demo's name lists (every combination, where the demo uses a few). */
export function personName(i: number): string {
  return `${contactFirst[i % contactFirst.length]} ${contactLast[Math.floor(i / contactFirst.length) % contactLast.length]}`;
}
