// The demo company's boards and parts lists: invented, but written the way a bench manual lists them —
// linear power supplies with their bridge rectifiers, filter electrolytics, fuses and header pins, a sound
// board and a solenoid driver board. Board part numbers are invented; component types (1N4004, LM7812, TIP102)
// are the generic ones such boards carried.
import { eq } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import type { BoardPartFields } from '../queries/board-parts.ts';
import { boardParts, gameModels, modelBoards } from '../schema/index.ts';

type Kind = (typeof boardParts.$inferInsert)['kind'];

/** A line of a demo parts list: what a parts-list save stores. */
export type DemoPart = BoardPartFields;

export interface DemoBoard {
  modelTitle: string;
  name: string;
  partNumber: string;
  notes: string;
  parts: DemoPart[];
}

const part = (designator: string, kind: Kind, value: string, tolerance = '', rating = '', notes = ''): DemoPart => ({
  designator,
  kind,
  value,
  tolerance,
  rating,
  ratedTemperatureC: null,
  ratedLifeHours: null,
  notes,
});
const resistor = (designator: string, value: string, tolerance: string, rating: string, notes = '') =>
  part(designator, 'resistor', value, tolerance, rating, notes);
const ceramic = (designator: string, value: string, tolerance: string, rating: string, notes = '') =>
  part(designator, 'capacitor', value, tolerance, rating, notes);
const electrolytic = (designator: string, value: string, rating: string, temperatureC: 85 | 105, lifeHours: number, notes = '') => ({
  ...part(designator, 'electrolytic', value, '±20%', rating, notes),
  ratedTemperatureC: temperatureC,
  ratedLifeHours: lifeHours,
});
const diode = (designator: string, value: string, rating = '', notes = '') => part(designator, 'diode', value, '', rating, notes);
const bridge = (designator: string, value: string, rating: string, notes = '') =>
  part(designator, 'bridge_rectifier', value, '', rating, notes);
const fuse = (designator: string, marking: string, notes = '') => part(designator, 'fuse', marking, '', '', notes);
const header = (designator: string, value: string, notes = '') => part(designator, 'connector', value, '', '', notes);
const transistor = (designator: string, value: string, notes = '') => part(designator, 'transistor', value, '', '', notes);
const regulator = (designator: string, value: string, notes = '') => part(designator, 'regulator', value, '', '', notes);
const other = (designator: string, value: string, notes = '') => part(designator, 'other', value, '', '', notes);

/** A run of designators: series('Q', 3, 8) → Q3 … Q8. */
const series = (prefix: string, from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => `${prefix}${from + i}`);

const RAISED = 'mount raised off the board so air flows under it';
const COOKED_PINS = 'pins discolour here: replace the header and the mating housing together';

/** Comet Carnival (1992): the power and driver supply of a solid-state pinball. */
const cometCarnivalPower: DemoBoard = {
  modelTitle: 'Comet Carnival',
  name: 'Power supply',
  partNumber: 'HA-520-0117',
  notes: 'Solenoid 50 V, flash lamps 32 V, general illumination 6.3 V AC, logic 5 V and 12 V.',
  parts: [
    fuse('F1', 'T2.5A 250V', 'mains primary'),
    fuse('F2', 'T2.5A 250V', 'mains primary, service outlet'),
    fuse('F3', 'F5A 250V', '+5 V logic secondary'),
    fuse('F4', 'T4A 250V', 'solenoid 50 V'),
    fuse('F5', 'T3.15A 250V', 'flash lamps 32 V'),
    fuse('F6', 'F8A 250V', 'general illumination string 1'),
    fuse('F7', 'F8A 250V', 'general illumination string 2'),
    fuse('F8', 'F1A 250V', '+12 V'),
    bridge('BR1', 'KBPC3506', '35 A 600 V', `+5 V logic; ${RAISED}`),
    bridge('BR2', 'KBPC3506', '35 A 600 V', `solenoid 50 V; ${RAISED}`),
    bridge('BR3', 'KBPC3506', '35 A 600 V', `flash lamps; ${RAISED}`),
    bridge('BR4', 'KBPC3506', '35 A 600 V', 'controlled lamps 18 V'),
    electrolytic('C1', '15000µF', '25 V', 85, 2000, '+5 V filter: the first part to dry out'),
    electrolytic('C2', '100µF', '100 V', 105, 5000, 'solenoid 50 V filter'),
    electrolytic('C3', '100µF', '100 V', 105, 5000, 'flash lamps filter'),
    electrolytic('C4', '10000µF', '25 V', 85, 2000, 'controlled lamps filter'),
    electrolytic('C5', '4700µF', '35 V', 85, 1000, '+12 V filter'),
    electrolytic('C6', '1000µF', '25 V', 105, 3000),
    electrolytic('C7', '100µF', '25 V', 105, 2000),
    electrolytic('C8', '10µF', '35 V', 85, 2000),
    electrolytic('C9', '10µF', '35 V', 85, 2000),
    ceramic('C10', '100nF', '10%', '50 V'),
    ceramic('C11', '100nF', '10%', '50 V'),
    ceramic('C12', '104', '10%', '50 V'),
    ceramic('C13', '10nF', '20%', '100 V'),
    ceramic('C14', '4n7', 'K', '1 kV', 'across the mains switch'),
    diode('D1', '1N5822', '3 A 40 V', RAISED),
    diode('D2', '1N4004', '1 A 400 V'),
    diode('D3', '1N4004', '1 A 400 V'),
    diode('D4', '1N4004', '1 A 400 V'),
    diode('D5', '1N4004', '1 A 400 V'),
    diode('D6', '1N4148', '100 V'),
    diode('D7', '1N4148', '100 V'),
    diode('D8', '1N5231B', '5.1 V zener', 'crowbar reference'),
    regulator('U1', 'LM323K', '+5 V 3 A in a TO-3 can on the heat sink; heat-sink compound under it'),
    regulator('U2', 'LM7812', '+12 V'),
    regulator('U3', 'LM317T', 'adjustable; sets the +5 V trim'),
    transistor('Q1', 'TIP42C', 'flash lamp enable'),
    transistor('Q2', '2N3904'),
    transistor('Q3', '2N3904'),
    transistor('Q4', '2N3906'),
    other('SCR1', '2N6400', 'crowbar on +5 V'),
    resistor('R1', '4k7', '5%', '1/4 W'),
    resistor('R2', '4k7', '5%', '1/4 W'),
    resistor('R3', '1k', '5%', '1/4 W'),
    resistor('R4', 'brown black orange gold', '', '1/4 W'),
    resistor('R5', '220', 'J', '1/2 W'),
    resistor('R6', '2k2', '5%', '1/4 W'),
    resistor('R7', '600', '±10 %', '5 W', 'bleeder across C2; runs warm'),
    resistor('R8', '0R22', '5%', '5 W', 'current sense'),
    resistor('R9', '120', '1%', '1/4 W', 'LM317 programming'),
    resistor('R10', '390', '1%', '1/4 W', 'LM317 programming'),
    resistor('R11', 'yellow violet red gold', '', '1/4 W'),
    resistor('R12', '10R', '5%', '2 W', 'discoloured board under it on most units'),
    resistor('R13', '47k', '5%', '1/4 W'),
    resistor('R14', '100k', '5%', '1/4 W'),
    header('J1', '.156 in header, 9 pins', `mains in; ${COOKED_PINS}`),
    header('J2', '.156 in header, 12 pins', `+5 V out; ${COOKED_PINS}`),
    header('J3', '.156 in header, 9 pins', 'solenoid and flash lamp power'),
    header('J4', '.156 in header, 7 pins', `general illumination; ${COOKED_PINS}`),
    header('J5', '.100 in header, 10 pins', 'status to the logic board'),
    other('TP1', 'test point +5 V', 'read 4.9–5.1 V at the logic board, not here'),
    other('TP2', 'test point GND'),
    other('TP3', 'test point +12 V'),
    other('LED1', 'red LED', '+5 V present'),
  ],
};

/** Midnight Rodeo (1989): an older supply with discrete diodes in place of some bridges. */
const midnightRodeoPower: DemoBoard = {
  modelTitle: 'Midnight Rodeo',
  name: 'Power supply',
  partNumber: 'HA-520-0093',
  notes: 'Earlier version of the Comet Carnival supply; the 5 V regulator sits on the board, not the cabinet.',
  parts: [
    fuse('F1', 'T2.5A 250V', 'mains primary'),
    fuse('F2', 'F5A 250V', '+5 V logic secondary'),
    fuse('F3', 'T4A 250V', 'solenoid 43 V'),
    fuse('F4', 'T3.15A 250V', 'flash lamps'),
    fuse('F5', 'F8A 250V', 'general illumination'),
    fuse('F6', 'F1A 250V', '+12 V'),
    bridge('BR1', 'KBPC3506', '35 A 600 V', `+5 V logic; ${RAISED}`),
    bridge('BR2', 'KBPC3506', '35 A 600 V', `solenoids; ${RAISED}`),
    ...series('D', 1, 4).map((d) => diode(d, '1N5401', '3 A 100 V', `flash lamp rectifier; ${RAISED}`)),
    ...series('D', 5, 10).map((d) => diode(d, '1N4004', '1 A 400 V')),
    diode('D11', '1N4148', '100 V'),
    diode('D12', '1N4148', '100 V'),
    electrolytic('C1', '18000µF', '15 V', 85, 1000, '+5 V filter'),
    electrolytic('C2', '160µF', '75 V', 85, 2000, 'solenoid filter'),
    electrolytic('C3', '3300µF', '25 V', 85, 2000, '+12 V filter'),
    electrolytic('C4', '470µF', '35 V', 105, 3000),
    electrolytic('C5', '100µF', '25 V', 105, 2000),
    electrolytic('C6', '22µF', '25 V', 85, 2000),
    electrolytic('C7', '10µF', '50 V', 85, 2000),
    ceramic('C8', '100nF', '10%', '50 V'),
    ceramic('C9', '100nF', '10%', '50 V'),
    ceramic('C10', '47nF', '20%', '100 V'),
    ceramic('C11', '1nF', 'K', '500 V'),
    regulator('U1', 'LM323K', '+5 V 3 A'),
    regulator('U2', 'LM7812', '+12 V'),
    transistor('Q1', 'TIP36C', 'pass transistor'),
    transistor('Q2', '2N3904'),
    transistor('Q3', '2N3904'),
    transistor('Q4', 'MJE15030'),
    resistor('R1', '2k7', '5%', '1/4 W'),
    resistor('R2', '2k7', '5%', '1/4 W'),
    resistor('R3', '1k', '5%', '1/4 W'),
    resistor('R4', '1k', '5%', '1/4 W'),
    resistor('R5', '330', '5%', '1/2 W'),
    resistor('R6', 'brown black red gold', '', '1/4 W'),
    resistor('R7', '8k2', '5%', '1/4 W'),
    resistor('R8', '3R9', '±10 %', '2 W'),
    resistor('R9', '1k2', '5%', '3 W', 'bleeder; runs hot'),
    resistor('R10', '100', '5%', '1/2 W'),
    resistor('R11', 'R47', 'J', '3 W', 'current sense'),
    resistor('R12', '27k', '5%', '1/4 W'),
    resistor('R13', 'brown black orange silver', '', '1/4 W'),
    header('J1', '.156 in header, 6 pins', `mains in; ${COOKED_PINS}`),
    header('J2', '.156 in header, 9 pins', `+5 V and +12 V out; ${COOKED_PINS}`),
    header('J3', '.156 in header, 9 pins', 'solenoid power'),
    header('J4', '.156 in header, 4 pins', 'general illumination'),
    other('TP1', 'test point +5 V'),
    other('TP2', 'test point GND'),
  ],
};

/** Star Courier (1983): a switching-free linear supply of an early video cabinet. */
const starCourierPower: DemoBoard = {
  modelTitle: 'Star Courier',
  name: 'Power supply',
  partNumber: 'KG-PS-8302',
  notes: 'Feeds the game board (+5 V, +12 V, −5 V) and the audio amplifier (25 V unregulated).',
  parts: [
    fuse('F1', 'T2A 250V', 'mains primary'),
    fuse('F2', 'F7A 250V', '+5 V secondary'),
    fuse('F3', 'F2A 250V', '+12 V secondary'),
    fuse('F4', 'F500mA 250V', '−5 V secondary'),
    fuse('F5', 'T1.6A 250V', 'audio 25 V'),
    bridge('BR1', 'GBPC2504', '25 A 400 V', `+5 V; ${RAISED}`),
    bridge('BR2', 'KBP206', '2 A 600 V', '+12 V'),
    bridge('BR3', 'KBP206', '2 A 600 V', 'audio'),
    diode('D1', '1N4004', '1 A 400 V', '−5 V half-wave'),
    diode('D2', '1N4004', '1 A 400 V'),
    diode('D3', '1N4004', '1 A 400 V'),
    diode('D4', '1N4004', '1 A 400 V'),
    diode('D5', '1N5400', '3 A 50 V', RAISED),
    diode('D6', '1N4148', '100 V'),
    electrolytic('C1', '22000µF', '16 V', 85, 1000, '+5 V filter; check for bulging tops'),
    electrolytic('C2', '2200µF', '35 V', 85, 2000, '+12 V filter'),
    electrolytic('C3', '1000µF', '16 V', 85, 2000, '−5 V filter'),
    electrolytic('C4', '4700µF', '50 V', 85, 2000, 'audio filter'),
    electrolytic('C5', '470µF', '16 V', 105, 2000),
    electrolytic('C6', '220µF', '25 V', 105, 2000),
    electrolytic('C7', '100µF', '16 V', 85, 2000),
    electrolytic('C8', '47µF', '16 V', 85, 2000),
    electrolytic('C9', '10µF', '25 V', 85, 1000),
    ceramic('C10', '100nF', '10%', '50 V'),
    ceramic('C11', '100nF', '10%', '50 V'),
    ceramic('C12', '100nF', '10%', '50 V'),
    ceramic('C13', '22nF', '20%', '100 V'),
    ceramic('C14', '10nF', 'M', '1 kV', 'mains filter'),
    regulator('U1', 'LM338K', '+5 V 5 A'),
    regulator('U2', 'LM7812', '+12 V'),
    regulator('U3', 'LM7905', '−5 V'),
    transistor('Q1', '2N3055', 'crowbar drive'),
    transistor('Q2', '2N3904'),
    other('SCR1', 'C106D', 'crowbar on +5 V'),
    resistor('R1', '240', '1%', '1/4 W', 'LM338 programming'),
    resistor('R2', '750', '1%', '1/4 W', 'LM338 programming'),
    resistor('R3', '1k', '5%', '1/4 W'),
    resistor('R4', '1k', '5%', '1/4 W'),
    resistor('R5', '10k', '5%', '1/4 W'),
    resistor('R6', 'red red red gold', '', '1/4 W'),
    resistor('R7', '47R', '5%', '1/2 W'),
    resistor('R8', '150', '±10 %', '1 W'),
    resistor('R9', '2R2', '5%', '5 W', 'inrush limiter on the audio supply'),
    resistor('R10', '15k', '5%', '1/4 W'),
    resistor('R11', '5k6', '5%', '1/4 W'),
    other('VR1', '1k trimmer', '+5 V adjust: set 5.05 V at the game board edge'),
    header('J1', '.156 in header, 6 pins', `mains in; ${COOKED_PINS}`),
    header('J2', '.156 in header, 10 pins', `game board power; ${COOKED_PINS}`),
    header('J3', '.156 in header, 4 pins', 'audio amplifier'),
    header('J4', '.156 in header, 3 pins', 'coin door lamps'),
    other('TP1', 'test point +5 V'),
    other('TP2', 'test point +12 V'),
    other('TP3', 'test point −5 V'),
    other('TP4', 'test point GND'),
  ],
};

/** Wallbox 120 (1998): the jukebox's power supply for its amplifier, mechanism and selector lamps. */
const wallboxPower: DemoBoard = {
  modelTitle: 'Wallbox 120',
  name: 'Power supply',
  partNumber: 'OM-PSU-120-3',
  notes: 'Amplifier rails ±35 V, mechanism 24 V, selector lamps 6.3 V AC, logic 5 V.',
  parts: [
    fuse('F1', 'T3.15A 250V', 'mains primary'),
    fuse('F2', 'T5A 250V', 'amplifier +35 V'),
    fuse('F3', 'T5A 250V', 'amplifier −35 V'),
    fuse('F4', 'T2A 250V', 'mechanism 24 V'),
    fuse('F5', 'F3.15A 250V', 'logic 5 V'),
    fuse('F6', 'F4A 250V', 'selector lamps'),
    bridge('BR1', 'GBPC3504', '35 A 400 V', `amplifier rails; ${RAISED}`),
    bridge('BR2', 'KBU808', '8 A 800 V', 'mechanism 24 V'),
    bridge('BR3', 'KBU808', '8 A 800 V', 'logic'),
    electrolytic('C1', '10000µF', '50 V', 105, 3000, 'amplifier +35 V'),
    electrolytic('C2', '10000µF', '50 V', 105, 3000, 'amplifier −35 V'),
    electrolytic('C3', '4700µF', '35 V', 105, 2000, 'mechanism 24 V'),
    electrolytic('C4', '6800µF', '16 V', 85, 2000, 'logic 5 V'),
    electrolytic('C5', '470µF', '35 V', 105, 5000),
    electrolytic('C6', '470µF', '35 V', 105, 5000),
    electrolytic('C7', '100µF', '50 V', 105, 2000),
    electrolytic('C8', '47µF', '50 V', 105, 2000),
    ceramic('C9', '100nF', '10%', '100 V'),
    ceramic('C10', '100nF', '10%', '100 V'),
    ceramic('C11', '100nF', '10%', '50 V'),
    ceramic('C12', '10nF', 'K', '1 kV'),
    diode('D1', '1N4007', '1 A 1000 V'),
    diode('D2', '1N4007', '1 A 1000 V'),
    diode('D3', '1N5819', '1 A 40 V'),
    diode('D4', '1N4148', '100 V'),
    diode('D5', '1N4148', '100 V'),
    diode('D6', '1N4744A', '15 V zener'),
    regulator('U1', 'LM7805', '+5 V, on the small heat sink'),
    regulator('U2', 'LM7824', '+24 V mechanism'),
    transistor('Q1', 'BD139'),
    transistor('Q2', 'BD140'),
    transistor('Q3', 'BC547'),
    resistor('R1', '4k7', '5%', '1/4 W'),
    resistor('R2', '4k7', '5%', '1/4 W'),
    resistor('R3', '10k', '5%', '1/4 W'),
    resistor('R4', '470', '5%', '1/2 W'),
    resistor('R5', '6k8', '5%', '1/2 W', 'bleeder, +35 V'),
    resistor('R6', '6k8', '5%', '1/2 W', 'bleeder, −35 V'),
    resistor('R7', '1R0', '5%', '2 W'),
    resistor('R8', 'orange orange brown gold', '', '1/4 W'),
    resistor('R9', '22k', '±10 %', '1/4 W'),
    other('RL1', 'relay 24 V coil, 10 A contacts', 'amplifier soft start'),
    other('NTC1', '5R thermistor', 'inrush limiter'),
    header('J1', 'IEC inlet with switch', 'mains in'),
    header('J2', '.156 in header, 8 pins', `amplifier rails; ${COOKED_PINS}`),
    header('J3', '.156 in header, 6 pins', 'mechanism'),
    header('J4', '.100 in header, 4 pins', 'logic 5 V'),
    header('J5', '.156 in header, 3 pins', 'selector lamps'),
  ],
};

/** Comet Carnival's sound board: a small amplifier and its filter. */
const cometCarnivalSound: DemoBoard = {
  modelTitle: 'Comet Carnival',
  name: 'Sound board',
  partNumber: 'HA-520-0122',
  notes: 'Speech and music; the amplifier runs from ±12 V made on the board.',
  parts: [
    fuse('F1', 'F2A 250V', 'amplifier supply'),
    bridge('BR1', 'W04M', '1.5 A 400 V'),
    electrolytic('C1', '2200µF', '25 V', 85, 2000, '+12 V filter'),
    electrolytic('C2', '2200µF', '25 V', 85, 2000, '−12 V filter'),
    electrolytic('C3', '470µF', '16 V', 105, 2000, 'speaker coupling'),
    electrolytic('C4', '100µF', '25 V', 85, 2000),
    electrolytic('C5', '47µF', '16 V', 85, 2000),
    electrolytic('C6', '10µF', '25 V', 85, 2000),
    electrolytic('C7', '10µF', '25 V', 85, 2000),
    electrolytic('C8', '4.7µF', '50 V', 85, 2000),
    electrolytic('C9', '1µF', '50 V', 85, 2000),
    ceramic('C10', '100nF', '10%', '50 V'),
    ceramic('C11', '100nF', '10%', '50 V'),
    ceramic('C12', '2n2', 'K', '100 V'),
    ceramic('C13', '470pF', '5%', '100 V'),
    regulator('U1', 'LM7812', '+12 V'),
    regulator('U2', 'LM7912', '−12 V'),
    other('U3', 'TDA2030', 'power amplifier; heat-sink compound under it'),
    other('U4', 'TL084', 'filters'),
    other('U5', 'MC1408', 'DAC'),
    diode('D1', '1N4148', '100 V'),
    diode('D2', '1N4148', '100 V'),
    resistor('R1', '10k', '5%', '1/4 W'),
    resistor('R2', '10k', '5%', '1/4 W'),
    resistor('R3', '22k', '5%', '1/4 W'),
    resistor('R4', '4k7', '5%', '1/4 W'),
    resistor('R5', '1k', '5%', '1/4 W'),
    resistor('R6', '1R0', '5%', '1/2 W', 'Zobel network'),
    resistor('R7', 'brown black yellow gold', '', '1/4 W'),
    other('VR1', '10k volume', 'a scratchy pot cleans with contact cleaner'),
    header('J1', '.156 in header, 4 pins', 'power in'),
    header('J2', '.100 in header, 26 pins', 'sound commands from the logic board'),
    header('J3', '.156 in header, 2 pins', 'speaker'),
  ],
};

/** Deep Sea Salvage's driver board: the solenoid and flash-lamp drivers. */
const deepSeaDriver: DemoBoard = {
  modelTitle: 'Deep Sea Salvage',
  name: 'Driver board',
  partNumber: 'HA-520-0140',
  notes: 'Sixteen solenoid drivers (TIP102) with their pre-drivers; a shorted coil takes the driver with it.',
  parts: [
    fuse('F1', 'T4A 250V', 'solenoids 1–8'),
    fuse('F2', 'T4A 250V', 'solenoids 9–16'),
    fuse('F3', 'T3.15A 250V', 'flash lamps'),
    ...series('Q', 1, 16).map((q) => transistor(q, 'TIP102', 'solenoid driver; check its coil before replacing')),
    ...series('Q', 17, 24).map((q) => transistor(q, '2N5401', 'pre-driver')),
    ...series('D', 1, 8).map((d) => diode(d, '1N4004', '1 A 400 V', 'flyback')),
    ...series('R', 1, 8).map((r) => resistor(r, '1k', '5%', '1/4 W')),
    resistor('R9', '4k7', '5%', '1/4 W'),
    resistor('R10', '4k7', '5%', '1/4 W'),
    resistor('R11', 'yellow violet red gold', '', '1/4 W'),
    electrolytic('C1', '100µF', '100 V', 105, 5000, 'solenoid rail'),
    electrolytic('C2', '10µF', '63 V', 85, 2000),
    ceramic('C3', '100nF', '10%', '100 V'),
    ceramic('C4', '100nF', '10%', '100 V'),
    header('J1', '.156 in header, 9 pins', `solenoids 1–8; ${COOKED_PINS}`),
    header('J2', '.156 in header, 9 pins', `solenoids 9–16; ${COOKED_PINS}`),
    header('J3', '.156 in header, 6 pins', 'flash lamps'),
    header('J4', '.100 in header, 20 pins', 'from the logic board'),
  ],
};

/** Every demo board, in the order they are seeded. */
export const demoBoards: readonly DemoBoard[] = [
  cometCarnivalPower,
  cometCarnivalSound,
  midnightRodeoPower,
  starCourierPower,
  wallboxPower,
  deepSeaDriver,
];

/** Board ids of the demo company by model title, then board name: `ids['Comet Carnival']['Power supply']`. */
export type DemoBoardIds = Record<string, Record<string, string>>;

/** Inserts the demo boards and their parts lists for the company (which already has the demo models). */
export async function seedPartsLists(tx: Tx, tenantId: string): Promise<DemoBoardIds> {
  const models = await tx.select({ id: gameModels.id, title: gameModels.title }).from(gameModels).where(eq(gameModels.tenantId, tenantId));
  const modelIdOf = new Map(models.map((m) => [m.title, m.id]));
  const ids: DemoBoardIds = {};
  for (const board of demoBoards) {
    const modelId = modelIdOf.get(board.modelTitle);
    if (!modelId) throw new Error(`the demo has no model "${board.modelTitle}"`);
    const [row] = await tx
      .insert(modelBoards)
      .values({ tenantId, modelId, name: board.name, partNumber: board.partNumber, notes: board.notes })
      .returning({ id: modelBoards.id });
    const boardId = row!.id;
    await tx.insert(boardParts).values(board.parts.map((p, i) => ({ ...p, tenantId, boardId, position: i + 1 })));
    (ids[board.modelTitle] ??= {})[board.name] = boardId;
  }
  return ids;
}
