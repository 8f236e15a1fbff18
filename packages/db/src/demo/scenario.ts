// Our own fictional scenario: "Lakeshore Tilt & Token", an operator company in the Chicago area
// (real neighbourhood coordinates; venue names, people, addresses, makers and titles all invented),
// and a small second company, "Prairie Pinball Partners", that must never see the first one's rows.

export const DEMO_PASSWORD = 'bumperline-demo';

export const demoCompany = {
  id: '6a1f0c2e-0d3b-4c55-9a51-1b3d7e2f4a01',
  name: 'Lakeshore Tilt & Token',
  timeZone: 'America/Chicago',
  currency: 'USD',
  locale: 'en-US',
};

export const secondCompany = {
  id: '8c4e2a10-5f6d-4b7e-8a9c-2d3e4f5a6b02',
  name: 'Prairie Pinball Partners',
  timeZone: 'America/Chicago',
  currency: 'USD',
  locale: 'en-US',
};

// Phone numbers use the 555-01xx range, which North American numbering reserves for fiction.
export const demoPeople = [
  { email: 'owner@lakeshore.example', name: 'Marguerite Oyelaran', role: 'owner', phone: '+13125550101' },
  { email: 'dispatch@lakeshore.example', name: 'Devon Castellanos', role: 'dispatcher', phone: '+13125550102' },
  { email: 'tech1@lakeshore.example', name: 'Ilse Brandvold', role: 'technician', phone: '+13125550111' },
  { email: 'tech2@lakeshore.example', name: 'Kofi Ansah-Whitfield', role: 'technician', phone: '+13125550112' },
  { email: 'tech3@lakeshore.example', name: 'Parveen Lutz', role: 'technician', phone: '+13125550113' },
  { email: 'venue@lakeshore.example', name: 'Hollis Varga', role: 'venue_contact', phone: null },
] as const;

/** Where each technician's day starts (real neighbourhood coordinates) and what they are good at. */
export const technicianProfiles: Record<string, { skills: string[]; lat: number; lon: number }> = {
  'tech1@lakeshore.example': { skills: ['pinball', 'jukebox', 'power-supply', 'recap'], lat: 41.9403, lon: -87.6533 },
  'tech2@lakeshore.example': { skills: ['video', 'pinball', 'monitor'], lat: 41.8564, lon: -87.6564 },
  'tech3@lakeshore.example': { skills: ['darts', 'jukebox', 'video'], lat: 41.885, lon: -87.7845 },
};

export const secondPeople = [
  { email: 'owner@prairie.example', name: 'Tamsin Okafor-Reyes', role: 'owner', phone: '+16305550121' },
] as const;

/** Real neighbourhood centres in the Chicago area (approximate, public map coordinates). */
export const neighbourhoods: { name: string; lat: number; lon: number; city: string; zip: string }[] = [
  { name: 'Wicker Park', lat: 41.9088, lon: -87.6796, city: 'Chicago', zip: '60622' },
  { name: 'Logan Square', lat: 41.9234, lon: -87.7083, city: 'Chicago', zip: '60647' },
  { name: 'Lincoln Park', lat: 41.9214, lon: -87.6513, city: 'Chicago', zip: '60614' },
  { name: 'Lakeview', lat: 41.9403, lon: -87.6533, city: 'Chicago', zip: '60657' },
  { name: 'Uptown', lat: 41.9665, lon: -87.6533, city: 'Chicago', zip: '60640' },
  { name: 'Andersonville', lat: 41.98, lon: -87.6685, city: 'Chicago', zip: '60640' },
  { name: 'Pilsen', lat: 41.8564, lon: -87.6564, city: 'Chicago', zip: '60608' },
  { name: 'Bridgeport', lat: 41.8381, lon: -87.6511, city: 'Chicago', zip: '60608' },
  { name: 'Hyde Park', lat: 41.7943, lon: -87.5907, city: 'Chicago', zip: '60615' },
  { name: 'West Loop', lat: 41.8827, lon: -87.6472, city: 'Chicago', zip: '60607' },
  { name: 'Avondale', lat: 41.9387, lon: -87.7112, city: 'Chicago', zip: '60618' },
  { name: 'Evanston', lat: 42.0451, lon: -87.6877, city: 'Evanston', zip: '60201' },
  { name: 'Oak Park', lat: 41.885, lon: -87.7845, city: 'Oak Park', zip: '60302' },
  { name: 'Berwyn', lat: 41.8506, lon: -87.7937, city: 'Berwyn', zip: '60402' },
];

const venueWords1 = [
  'Copper',
  'Lantern',
  'Velvet',
  'Rusty',
  'Blue Heron',
  'Third Rail',
  'Northside',
  'Ember',
  'Harbor',
  'Tin Cup',
  'Old Mill',
  'Crooked',
  'Stag',
  'Foxglove',
  'Drumlin',
  'Magpie',
  'Cobalt',
  'Juniper',
  'Quarry',
  'Kettle',
];
const venueWords2 = [
  'Tap',
  'Tavern',
  'Lanes',
  'Social Club',
  'Alehouse',
  'Arcade Bar',
  'Lounge',
  'Pub',
  'Bowl',
  'Diner',
  'Saloon',
  'Taproom',
];
export const streets = [
  'Larkspur Ave',
  'Tamarack St',
  'Cinder Row',
  'Brackett Blvd',
  'Wexley Ave',
  'Osgood Pl',
  'Fennimore St',
  'Halvard Ave',
  'Quill Ct',
  'Rendell St',
  'Marlowe Ave',
  'Ashgrove Rd',
  'Petrie St',
  'Loomis Row',
];

export const contactFirst = [
  'Rosalind',
  'Tobias',
  'Marisol',
  'Desmond',
  'Ingrid',
  'Lamar',
  'Yusuf',
  'Greta',
  'Colm',
  'Anika',
  'Bartholomew',
  'Soledad',
  'Emeka',
  'Wren',
];
export const contactLast = [
  'Halvorsen',
  'Okonkwo',
  'Prendergast',
  'Zielinski',
  'Abernathy',
  'Villanueva',
  'Thistlewood',
  'Mbeki',
  'Castellano',
  'Fairbairn',
  'Novak',
  'Quintero',
];

export function contactName(i: number): string {
  return `${contactFirst[(i * 3) % contactFirst.length]} ${contactLast[(i * 5 + 1) % contactLast.length]}`;
}

export function venueName(i: number): string {
  return `${venueWords1[i % venueWords1.length]} ${venueWords2[(i * 7 + 3) % venueWords2.length]}`;
}

/** Invented makers and titles; kind and year make the fleet look like a real route. */
export const demoModels = [
  { maker: 'Halloway Amusement', title: 'Comet Carnival', kind: 'pinball', year: 1992 },
  { maker: 'Halloway Amusement', title: 'Deep Sea Salvage', kind: 'pinball', year: 1995 },
  { maker: 'Halloway Amusement', title: 'Midnight Rodeo', kind: 'pinball', year: 1989 },
  { maker: 'Brightwater Coin', title: 'Thunder Canyon', kind: 'pinball', year: 2014 },
  { maker: 'Brightwater Coin', title: 'Lunar Orchard', kind: 'pinball', year: 2019 },
  { maker: 'Kestrel Games', title: 'Alley Brawler II', kind: 'video', year: 1994 },
  { maker: 'Kestrel Games', title: 'Star Courier', kind: 'video', year: 1983 },
  { maker: 'Kestrel Games', title: 'Turbo Harvest', kind: 'video', year: 2001 },
  { maker: 'Ostrander Music', title: 'Wallbox 120', kind: 'jukebox', year: 1998 },
  { maker: 'Ostrander Music', title: 'StreamDeck Tower', kind: 'jukebox', year: 2016 },
  { maker: 'Bullseye Works', title: 'Cricket Pro 9', kind: 'darts', year: 2012 },
  { maker: 'Bullseye Works', title: 'Oche Master', kind: 'darts', year: 2018 },
] as const;

/** Typical bar opening hours (ISO weekday → windows), varied a little per venue. */
export function openingHoursFor(i: number) {
  const open = i % 3 === 0 ? '11:00' : i % 3 === 1 ? '15:00' : '12:00';
  const late = i % 2 === 0 ? '23:59' : '23:00';
  return {
    '1': [{ open, close: '23:00' }],
    '2': [{ open, close: '23:00' }],
    '3': [{ open, close: '23:00' }],
    '4': [{ open, close: late }],
    '5': [{ open: '11:00', close: '23:59' }],
    '6': [{ open: '11:00', close: '23:59' }],
    ...(i % 4 === 0 ? {} : { '7': [{ open: '11:00', close: '22:00' }] }),
  };
}
