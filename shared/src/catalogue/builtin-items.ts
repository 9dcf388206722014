/**
 * The built-in item catalogue: common things found loose on scaffold boards, with a typical mass
 * and shape. Every figure says where it comes from. Standards named here fix sizes or classes,
 * rarely masses: a mass worked out from a size and a density says so, and a figure recalled from
 * memory (not checked against a document while writing) is marked "recalled from memory". Rules of
 * thumb are marked "common practice, no source". Inspectors should weigh or measure an item when
 * it matters; these are starting points for an estimate, not data to rely on.
 *
 * Ids are fixed so the server can upsert the list at every start without duplicates.
 */
import type { ShapeSpec } from '../physics/shape.js';
import type { CatalogueCategory } from './catalogue-item.schema.js';

export interface BuiltinItem {
  id: string;
  name: string;
  category: CatalogueCategory;
  /** kg */
  massKg: number;
  shape: ShapeSpec;
  source: string;
}

const id = (n: number) => `c47a1000-0000-4000-8000-${n.toString(16).padStart(12, '0')}`;

export const BUILTIN_ITEMS: readonly BuiltinItem[] = [
  // Hand tools
  {
    id: id(1),
    name: 'Scaffold hammer',
    category: 'hand-tool',
    massKg: 0.7,
    shape: { kind: 'box', lengthM: 0.33, widthM: 0.11, heightM: 0.035 },
    source: 'Typical 20 oz (0.57 kg) head with handle; recalled from memory',
  },
  {
    id: id(2),
    name: 'Podger spanner (21 mm)',
    category: 'hand-tool',
    massKg: 0.45,
    shape: { kind: 'rod', lengthM: 0.3, diameterM: 0.02 },
    source: "Makers' catalogues list 0.4–0.5 kg for a 21 mm (7/16 Whitworth) podger; recalled from memory",
  },
  {
    id: id(3),
    name: 'Ratchet spanner (21 mm)',
    category: 'hand-tool',
    massKg: 0.55,
    shape: { kind: 'rod', lengthM: 0.3, diameterM: 0.03 },
    source: "Makers' catalogues list about 0.5–0.6 kg; recalled from memory",
  },
  {
    id: id(4),
    name: 'Tape measure (8 m)',
    category: 'hand-tool',
    massKg: 0.35,
    shape: { kind: 'box', lengthM: 0.085, widthM: 0.08, heightM: 0.045 },
    source: "Makers' data for an 8 m × 25 mm tape, about 0.3–0.4 kg; recalled from memory",
  },
  {
    id: id(5),
    name: 'Cordless drill with battery',
    category: 'hand-tool',
    massKg: 1.8,
    shape: { kind: 'box', lengthM: 0.25, widthM: 0.22, heightM: 0.08 },
    source: "Makers' data for an 18 V combi drill with a 2 Ah battery, about 1.6–2.0 kg; recalled from memory",
  },
  {
    id: id(6),
    name: 'Spirit level (600 mm)',
    category: 'hand-tool',
    massKg: 0.5,
    shape: { kind: 'plate', lengthM: 0.6, widthM: 0.055, thicknessM: 0.025 },
    source: "Makers' data for a 600 mm box-section aluminium level; recalled from memory",
  },
  {
    id: id(7),
    name: 'Brick trowel',
    category: 'hand-tool',
    massKg: 0.35,
    shape: { kind: 'plate', lengthM: 0.39, widthM: 0.12, thicknessM: 0.02 },
    source: "Makers' data for an 11 in (280 mm blade) brick trowel; recalled from memory",
  },
  // Fittings
  {
    id: id(8),
    name: 'Right-angle coupler',
    category: 'fitting',
    massKg: 1.1,
    shape: { kind: 'box', lengthM: 0.1, widthM: 0.1, heightM: 0.075 },
    source: "BS EN 74-1 class B right-angle coupler for 48.3 mm tube; mass from makers' data sheets (pressed steel 1.0–1.2 kg, drop-forged up to 1.4 kg), recalled from memory",
  },
  {
    id: id(9),
    name: 'Swivel coupler',
    category: 'fitting',
    massKg: 1.4,
    shape: { kind: 'box', lengthM: 0.16, widthM: 0.08, heightM: 0.075 },
    source: "BS EN 74-1 class A swivel coupler for 48.3 mm tube; mass from makers' data sheets (about 1.2–1.6 kg), recalled from memory",
  },
  {
    id: id(10),
    name: 'Sleeve coupler',
    category: 'fitting',
    massKg: 1.0,
    shape: { kind: 'cylinder', lengthM: 0.16, diameterM: 0.07 },
    source: "BS EN 74-1 sleeve coupler (expanding spigot types are in BS EN 74-1 too); mass from makers' data sheets, about 1.0 kg, recalled from memory",
  },
  {
    id: id(11),
    name: 'Putlog coupler',
    category: 'fitting',
    massKg: 0.6,
    shape: { kind: 'box', lengthM: 0.09, widthM: 0.07, heightM: 0.06 },
    source: "Putlog (single) coupler, BS 1139-2.2 type; mass from makers' data sheets, about 0.5–0.7 kg, recalled from memory",
  },
  {
    id: id(12),
    name: 'Base plate',
    category: 'fitting',
    massKg: 1.5,
    shape: { kind: 'plate', lengthM: 0.15, widthM: 0.15, thicknessM: 0.06 },
    source: 'BS EN 74-3 base plate 150 × 150 mm: a 6 mm steel plate at 7,850 kg/m³ is 1.06 kg, plus the spigot; about 1.5 kg, worked out here',
  },
  {
    id: id(13),
    name: 'Scaffold board clip',
    category: 'fitting',
    massKg: 0.45,
    shape: { kind: 'box', lengthM: 0.12, widthM: 0.06, heightM: 0.05 },
    source: "Board retaining clip; makers' data sheets list about 0.4–0.5 kg, recalled from memory",
  },
  {
    id: id(14),
    name: 'Toe-board clip',
    category: 'fitting',
    massKg: 0.35,
    shape: { kind: 'box', lengthM: 0.15, widthM: 0.06, heightM: 0.04 },
    source: "Pressed-steel toe-board clip; makers' data sheets list about 0.3–0.4 kg, recalled from memory",
  },
  // Boards
  {
    id: id(15),
    name: 'Scaffold board (3.9 m)',
    category: 'board',
    massKg: 20,
    shape: { kind: 'plate', lengthM: 3.9, widthM: 0.225, thicknessM: 0.038 },
    source: 'BS 2482 board 225 × 38 mm, 3.9 m long (13 ft); 0.0333 m³ at about 600 kg/m³ for seasoned softwood gives 20 kg; density recalled from memory',
  },
  {
    id: id(16),
    name: 'Board offcut (1 m)',
    category: 'board',
    massKg: 5.1,
    shape: { kind: 'plate', lengthM: 1.0, widthM: 0.225, thicknessM: 0.038 },
    source: 'BS 2482 board section 225 × 38 mm, 1 m long, at about 600 kg/m³ (density recalled from memory)',
  },
  // Tube
  {
    id: id(17),
    name: 'Tube offcut (0.5 m)',
    category: 'tube',
    massKg: 2.2,
    shape: { kind: 'rod', lengthM: 0.5, diameterM: 0.0483 },
    source: 'BS EN 39 type 4 steel tube 48.3 × 4.0 mm, 4.37 kg/m (recalled from memory), 0.5 m long',
  },
  {
    id: id(18),
    name: 'Scaffold tube (2 m)',
    category: 'tube',
    massKg: 8.7,
    shape: { kind: 'rod', lengthM: 2.0, diameterM: 0.0483 },
    source: 'BS EN 39 type 4 steel tube 48.3 × 4.0 mm, 4.37 kg/m (recalled from memory), 2 m long',
  },
  // Materials
  {
    id: id(19),
    name: 'Brick',
    category: 'material',
    massKg: 2.7,
    shape: { kind: 'box', lengthM: 0.215, widthM: 0.1025, heightM: 0.065 },
    source: 'UK work size 215 × 102.5 × 65 mm (BS EN 771-1 and its UK national annex); solid clay at about 1,900 kg/m³ gives 2.7 kg; density recalled from memory (frogged or perforated bricks are lighter)',
  },
  {
    id: id(20),
    name: 'Concrete block (dense, 100 mm)',
    category: 'material',
    massKg: 19,
    shape: { kind: 'box', lengthM: 0.44, widthM: 0.215, heightM: 0.1 },
    source: 'Work size 440 × 215 × 100 mm (BS EN 771-3); dense aggregate at about 2,000 kg/m³ gives 19 kg; density recalled from memory',
  },
  {
    id: id(21),
    name: 'Bucket of mortar',
    category: 'material',
    massKg: 20,
    shape: { kind: 'cylinder', lengthM: 0.28, diameterM: 0.3 },
    source: 'About 10 L of mortar at about 2,000 kg/m³ in a builder’s bucket; common practice, no source',
  },
  {
    id: id(22),
    name: 'Bag of cement (25 kg)',
    category: 'material',
    massKg: 25,
    shape: { kind: 'box', lengthM: 0.6, widthM: 0.4, heightM: 0.11 },
    source: "The usual UK pack size printed on the bag (25 kg); bag size recalled from memory",
  },
  {
    id: id(23),
    name: 'Paving slab (600 × 600 × 50 mm)',
    category: 'material',
    massKg: 41,
    shape: { kind: 'plate', lengthM: 0.6, widthM: 0.6, thicknessM: 0.05 },
    source: 'Concrete flag of a common size (BS EN 1339 covers concrete flags); 0.018 m³ at about 2,300 kg/m³ gives 41 kg; density recalled from memory',
  },
  // Debris
  {
    id: id(24),
    name: 'Timber offcut (100 × 50 mm, 0.5 m)',
    category: 'debris',
    massKg: 1.3,
    shape: { kind: 'box', lengthM: 0.5, widthM: 0.1, heightM: 0.05 },
    source: 'Sawn softwood at about 500 kg/m³ (recalled from memory): 0.0025 m³ gives 1.25 kg',
  },
  {
    id: id(25),
    name: 'Half brick (bat)',
    category: 'debris',
    massKg: 1.3,
    shape: { kind: 'box', lengthM: 0.1, widthM: 0.1025, heightM: 0.065 },
    source: 'Half of the built-in brick (2.7 kg); common practice, no source',
  },
  {
    id: id(26),
    name: 'Plywood offcut (600 × 600 × 18 mm)',
    category: 'debris',
    massKg: 3.9,
    shape: { kind: 'plate', lengthM: 0.6, widthM: 0.6, thicknessM: 0.018 },
    source: 'Softwood plywood at about 600 kg/m³ (recalled from memory): 0.00648 m³ gives 3.9 kg',
  },
];
