import { z } from 'zod';
import { VERDICTS } from '../analyze/types';

/**
 * The Linewright project file: one schema, every type inferred from it.
 *
 * Direction is explicit: a conductor or bus link runs `from` the supply side
 * `to` the load side (line → load, primary → secondary). Every optional
 * engineering fact that a rule needs and the user has not entered stays
 * absent, so the analyzer can say "incomplete" instead of guessing.
 */

export const PROJECT_FORMAT = 'linewright-project';
export const PROJECT_VERSION = 2;

export const nodeId = z.string().min(1, 'an id must not be empty').max(64).brand<'NodeId'>();
export type NodeId = z.infer<typeof nodeId>;
export const conductorId = z.string().min(1, 'an id must not be empty').max(64).brand<'ConductorId'>();
export type ConductorId = z.infer<typeof conductorId>;
export const busLinkId = z.string().min(1, 'an id must not be empty').max(64).brand<'BusLinkId'>();
export type BusLinkId = z.infer<typeof busLinkId>;

const label = z.string().max(200);
const amps = z.number().positive().max(100_000);
const volts = z.number().positive().max(1000, 'Linewright covers systems of 1000 V and less');
const kiloAmps = z.number().positive().max(500);
const phases = z.union([z.literal(1), z.literal(3)]);
const position = z.strictObject({ x: z.number().finite(), y: z.number().finite() });

/** Conductor sizes of NFPA 70 Table 310.16, AWG then kcmil, smallest first. */
export const CONDUCTOR_SIZES = [
  '18', '16', '14', '12', '10', '8', '6', '4', '3', '2', '1', '1/0', '2/0', '3/0', '4/0',
  '250', '300', '350', '400', '500', '600', '700', '750', '800', '900', '1000', '1250', '1500', '1750', '2000',
] as const;
export const conductorSize = z.enum(CONDUCTOR_SIZES);
export type ConductorSize = z.infer<typeof conductorSize>;

export const MATERIALS = ['cu', 'al', 'cu-clad-al'] as const;
export const material = z.enum(MATERIALS);
export type Material = z.infer<typeof material>;

/** Insulation types; their temperature rating and class live in tables/insulation.ts. */
export const INSULATIONS = ['TW', 'UF', 'THW', 'THWN', 'RHW', 'XHHW', 'USE', 'THHN', 'THWN-2', 'THHW', 'XHHW-2', 'RHH', 'RHW-2', 'USE-2'] as const;
export const insulation = z.enum(INSULATIONS);
export type Insulation = z.infer<typeof insulation>;

export const WIRING_METHODS = ['steel-conduit', 'aluminum-conduit', 'pvc-conduit', 'cable', 'cable-tray', 'open'] as const;
export const wiringMethod = z.enum(WIRING_METHODS);
export type WiringMethod = z.infer<typeof wiringMethod>;

export const DAMAGE_PROTECTION = ['raceway', 'other-approved-means', 'none'] as const;

/** Raceway kinds of Chapter 9 Table 4 the takeoff sizes (HDPE shares the PVC Schedule 40 row). */
export const RACEWAY_KINDS = ['EMT', 'IMC', 'RMC', 'PVC-40', 'PVC-80'] as const;
export const racewayKind = z.enum(RACEWAY_KINDS);
export type RacewayKind = z.infer<typeof racewayKind>;

/** Whether a run carries a neutral: 'auto' decides from the system and the loads it serves. */
export const NEUTRAL_CHOICES = ['auto', 'yes', 'no'] as const;

const common = {
  id: nodeId,
  label: label.optional(),
  notes: z.string().max(4000).optional(),
  position: position.optional(),
};

export const utilityNode = z.strictObject({
  ...common,
  kind: z.literal('utility'),
  voltsLL: volts.describe('Line-to-line voltage, V (1000 V and less).'),
  phases,
  availableFaultKA: kiloAmps.optional().describe('Available three-phase fault current at the source, kA.'),
  xOverR: z.number().positive().max(100).optional().describe('X/R ratio of the source.'),
});

export const generatorNode = z.strictObject({
  ...common,
  kind: z.literal('generator'),
  voltsLL: volts.describe('Line-to-line voltage, V (1000 V and less).'),
  phases,
  kva: z.number().positive().max(50_000).describe('Rating, kVA.'),
  /** 445.13: the design prevents overload, so 100 % of nameplate instead of 115 %. */
  overloadPreventedByDesign: z.boolean().default(false).describe('445.13: the design prevents overload, so 100 % of nameplate instead of 115 %.'),
  subtransientReactancePu: z.number().positive().max(1).optional().describe('Subtransient reactance X″d, per unit on the generator\'s kVA (data sheet); a typical value is used when absent.'),
  xOverR: z.number().positive().max(100).optional().describe('X/R of the generator (X″d over armature resistance); a typical value is used when absent.'),
});

export const BUS_TYPES = ['switchgear', 'switchboard', 'panelboard', 'tap-box', 'busway'] as const;
export const busNode = z.strictObject({
  ...common,
  kind: z.literal('bus'),
  busType: z.enum(BUS_TYPES).describe('Kind of bus: switchgear, switchboard, panelboard, tap box or busway.'),
  busRatingA: amps.optional().describe('Bus rating, A; counts as the rating of the equipment a 10 ft tap ends in.'),
  sccrKA: kiloAmps.optional().describe('110.10: short-circuit current rating of the equipment (switchboard, panelboard…), kA symmetrical.'),
});

const ocpdCommon = {
  ...common,
  /** Rating in A; for an adjustable-trip breaker the rating that 240.6(B)/(C) makes count. */
  ratingA: amps.optional().describe('Rating in A; for an adjustable-trip breaker the rating that 240.6(B)/(C) makes count.'),
  interruptingKA: kiloAmps.optional().describe('Interrupting rating, kA.'),
  clearingTimeS: z.number().positive().max(10).optional().describe('Clearing time at the available fault current, s.'),
  /** 'single': one breaker or one set of fuses; 'group': several devices counted together. */
  arrangement: z.enum(['single', 'group']).default('single').describe('\'single\': one breaker or one set of fuses; \'group\': several devices counted together.'),
  /** 240.21(B)(5), (C)(4): the device is part of or next to the disconnecting means. */
  atDisconnectingMeans: z.boolean().default(false).describe('240.21(B)(5), (C)(4): the device is part of or next to the disconnecting means.'),
  /** 240.21(B)(5), (C)(4): where that disconnecting means is. */
  disconnectLocation: z.enum(['outside', 'inside-nearest-entrance', 'elsewhere']).optional().describe('240.21(B)(5), (C)(4): where that disconnecting means is.'),
};

export const breakerNode = z.strictObject({
  ...ocpdCommon,
  kind: z.literal('breaker'),
  /** Table 430.52: an inverse-time breaker (the usual kind, and the reading when not stated) or an instantaneous-trip one (motor circuit protector). */
  tripType: z.enum(['inverse-time', 'instantaneous']).optional().describe('Table 430.52: inverse-time (the usual breaker; the reading when not stated) or instantaneous-trip (a motor circuit protector).'),
  /** 240.6(B): adjustable long-time pickup; with restricted access 240.6(C) lets the setting count. */
  adjustableTrip: z
    .object({
      maxSettingA: amps,
      longTimeSettingA: amps,
      restrictedAccess: z.boolean().default(false),
    })
    .optional(),
});

export const fuseNode = z.strictObject({
  ...ocpdCommon,
  kind: z.literal('fuse'),
  currentLimiting: z.boolean().default(false).describe('A current-limiting fuse.'),
  /** Table 430.52: a time-delay (dual-element) fuse or a non-time-delay one; not stated, a motor circuit is judged on what both allow. */
  timeDelay: z.boolean().optional().describe('Table 430.52: a time-delay (dual-element) fuse (true) or non-time-delay (false); not stated, a motor circuit is judged on what both allow.'),
});

export const disconnectNode = z.strictObject({
  ...common,
  kind: z.literal('disconnect'),
  ratingA: amps.optional(),
});

export const spliceNode = z.strictObject({ ...common, kind: z.literal('splice') });

export const TRANSFORMER_CONNECTIONS = [
  'delta-wye', 'delta-delta-3w', 'delta-delta-4w', 'wye-wye', 'wye-delta', 'single-phase-2w', 'single-phase-3w',
] as const;
export const transformerNode = z.strictObject({
  ...common,
  kind: z.literal('transformer'),
  kva: z.number().positive().max(50_000).describe('Rating, kVA.'),
  primaryVoltsLL: volts.describe('Primary line-to-line voltage, V.'),
  secondaryVoltsLL: volts.describe('Secondary line-to-line voltage, V.'),
  phases,
  impedancePct: z.number().positive().max(30).optional().describe('Impedance, %Z.'),
  xOverR: z.number().positive().max(100).optional().describe('X/R ratio of the transformer impedance; a typical value by kVA is used when absent.'),
  connection: z.enum(TRANSFORMER_CONNECTIONS).describe('Winding connection; 240.21(C)(1) needs single-phase-2w or delta-delta-3w.'),
});

export const MOTOR_TYPES = ['induction', 'design-b-energy-efficient', 'synchronous', 'wound-rotor', 'dc'] as const;

/** A motor: Article 430 sizes its conductors and its short-circuit device from the table full-load current. */
export const motorFacts = z.strictObject({
  hp: z.number().positive().max(500).optional().describe('Horsepower; the full-load current then comes from Table 430.248 (single-phase) or 430.250 (three-phase) at the load\'s voltage (430.6(A)).'),
  fullLoadA: amps.optional().describe('Nameplate full-load current, A; used where the tables do not apply or no horsepower is given.'),
  motorType: z.enum(MOTOR_TYPES).optional().describe('Table 430.52 row: induction (squirrel-cage, the reading when not stated), design-b-energy-efficient, synchronous, wound-rotor or dc.'),
});
export type MotorFacts = z.infer<typeof motorFacts>;

/** Air-conditioning or refrigeration equipment with its nameplate (440.4(B)). */
export const hvacFacts = z.strictObject({
  mcaA: amps.describe('Nameplate minimum circuit ampacity (MCA), A (440.4(B), 440.35).'),
  mopA: amps.describe('Nameplate maximum overcurrent protective device (MOP), A (440.4(B), 440.22).'),
});
export type HvacFacts = z.infer<typeof hvacFacts>;

export const LOAD_CONNECTIONS = ['line-to-neutral', 'line-to-line'] as const;

export const loadNode = z.strictObject({
  ...common,
  kind: z.literal('load'),
  /** Exactly one of currentA or kva, unless the load is a motor or HVAC equipment, which carry their own current. */
  currentA: amps.optional().describe('Exactly one of currentA or kva (a motor or HVAC unit may give neither).'),
  kva: z.number().positive().max(50_000).optional().describe('Rating, kVA.'),
  powerFactor: z.number().gt(0).max(1).default(0.9).describe('Power factor, 0–1.'),
  /** Continuous: maximum current for 3 h or more (Article 100). */
  continuous: z.boolean().default(false).describe('Continuous: maximum current for 3 h or more (Article 100).'),
  /** Phases of the load itself; defaults to the system's. */
  phases: phases.optional().describe('Phases of the load itself; defaults to the system\'s.'),
  faultContributionXFlc: z.number().positive().max(10).optional().describe('Motor contribution to a fault, as a multiple of this load\'s full-load current (common practice: 4 for induction motors, 5 for synchronous); absent means none.'),
  /**
   * A single-phase load's connection: line to neutral (277 V on 480Y/277, 120 V on 208Y/120 or
   * 120/240) or line to line (480 V, 208 V, 240 V). Not stated: the reading that gives the larger
   * figure (a kVA load draws its current at the lower voltage; a load in amperes counts its VA at
   * the higher), which is how files without this field were read where that was right.
   */
  connection: z.enum(LOAD_CONNECTIONS).optional().describe('Single-phase loads: line-to-neutral or line-to-line. Not stated: whichever gives the larger current (kVA loads) or volt-amperes (loads in amperes).'),
  motor: motorFacts.optional().describe('A motor load (Article 430).'),
  hvac: hvacFacts.optional().describe('Air-conditioning or refrigeration equipment with a nameplate MCA and MOP (Article 440).'),
});

export const equipmentNode = z.discriminatedUnion('kind', [
  utilityNode, generatorNode, busNode, breakerNode, fuseNode, disconnectNode, spliceNode, transformerNode, loadNode,
]);
export type EquipmentNode = z.infer<typeof equipmentNode>;
export type EquipmentKind = EquipmentNode['kind'];
export type NodeOfKind<K extends EquipmentKind> = Extract<EquipmentNode, { kind: K }>;
export const EQUIPMENT_KINDS = equipmentNode.options.map((o) => o.shape.kind.value) as EquipmentKind[];

export const highBayFacts = z.strictObject({
  horizontalFt: z.number().nonnegative().max(20_000).describe('240.21(B)(4): horizontal part of the tap, ft.'),
  tapHeightAboveFloorFt: z.number().nonnegative().max(1_000).describe('240.21(B)(4): height of the tap point above the floor, ft.'),
  penetratesWallFloorCeiling: z.boolean().default(false).describe('240.21(B)(4): the tap passes through a wall, floor or ceiling.'),
});

export const conductor = z.strictObject({
  id: conductorId,
  from: nodeId.describe('Id of the equipment on the supply (line) side.'),
  to: nodeId.describe('Id of the equipment on the load side.'),
  label: label.optional(),
  notes: z.string().max(4000).optional(),
  material: material.default('cu').describe('cu, al or cu-clad-al.'),
  /** Not stated: the size is unknown, the conductor's verdict is incomplete ("needs the size") and every other verdict still comes out. */
  size: conductorSize.optional().describe('AWG (18–4/0) or kcmil (250–2000), as a string: "3/0", "500". Not stated: the size is unknown and this conductor is judged incomplete (needs the size); every other verdict still comes out.'),
  parallelSets: z.number().int().min(1).max(20).default(1).describe('Conductors in parallel per phase (310.10(G): 1/0 and larger).'),
  insulation: insulation.default('THHN').describe('Insulation type; sets the temperature column (Table 310.4(1)).'),
  /** Conductor length from its supply point to its termination; a raceway length is not a tap length. */
  lengthFt: z.number().positive().max(20_000, 'a run longer than 20 000 ft is not a building conductor; check the units').optional().describe('Conductor length from its supply point to its termination; a raceway length is not a tap length.'),
  wiring: wiringMethod.default('steel-conduit').describe('Wiring method; the conduit kinds count as a raceway.'),
  ambientC: z.number().min(-40).max(90).default(30).describe('Ambient temperature, °C (Table 310.15(B)(1)).'),
  /** Current-carrying conductors in the raceway or cable, all sets counted (310.15(C)(1)). */
  currentCarrying: z.number().int().min(1).max(200).default(3).describe('Current-carrying conductors in the raceway or cable, all sets counted (310.15(C)(1)); the circuit\'s own 310.15(E) count (neutral and nonlinear load considered) is used where it is larger.'),
  /** 110.14(C): lowest temperature rating of the terminations at either end; not stated, the project's terminationDefault decides. */
  terminalTempC: z.union([z.literal(60), z.literal(75), z.literal(90)]).optional().describe('110.14(C): lowest temperature rating of the terminations at either end. Not stated: the project setting terminationDefault decides (75 °C where equipment is listed for it, or per 110.14(C)(1)).'),
  /**
   * 240.21(B)(1), (C)(2): a field installation that leaves the enclosure where the tap is made.
   * Absent means not stated: a tap between two pieces of equipment leaves the enclosure, so the
   * rules take the conservative case (leaving) and say so in the working.
   */
  leavesEnclosure: z.boolean().optional().describe('240.21(B)(1), (C)(2): a field installation that leaves the enclosure where the tap is made. Not stated: taken as leaving (the conservative case).'),
  /** 240.21(B)(1), (C)(2): the conductor runs past the equipment it supplies. */
  extendsBeyondEquipment: z.boolean().default(false).describe('240.21(B)(1), (C)(2): the conductor runs past the equipment it supplies.'),
  /** 240.21(B)(5), (C)(4): outdoors except at the point of termination. */
  outdoors: z.boolean().default(false).describe('240.21(B)(5), (C)(4): outdoors except at the point of termination.'),
  damageProtection: z.enum(DAMAGE_PROTECTION).default('raceway').describe('How the run is protected from physical damage: raceway, other-approved-means (AHJ judgement) or none.'),
  /** 240.4(B)(1): a multioutlet branch circuit supplying receptacles for cord-and-plug loads. */
  multioutletCordAndPlug: z.boolean().default(false).describe('240.4(B)(1): a multioutlet branch circuit supplying receptacles for cord-and-plug loads.'),
  highBay: highBayFacts.optional().describe('240.21(B)(4) facts for a high-bay tap.'),
  neutral: z.enum(NEUTRAL_CHOICES).optional().describe(
    "Takeoff: does this run carry a neutral? 'auto' (default) carries one where the supply has a neutral and the run serves distribution equipment, single-phase loads or the service; 'yes' or 'no' states it.",
  ),
  neutralSize: conductorSize.optional().describe('Takeoff: size of the neutral when it is not the phase size (a reduced neutral by 220.61); one per parallel set.'),
  nonlinearLoad: z.boolean().optional().describe('310.15(E)(3): the major portion of the load is nonlinear, so the neutral of a 3-phase 4-wire wye circuit counts as current-carrying.'),
  raceway: racewayKind.optional().describe('Takeoff: raceway kind for Chapter 9 fill (EMT, IMC, RMC, PVC-40, PVC-80); when absent, steel conduit is taken as EMT, aluminum conduit as RMC, PVC conduit as PVC-40.'),
  egcSize: conductorSize.optional().describe('Takeoff: size of the wire-type equipment grounding conductor (or supply-side bonding jumper) when the designer chose one; a size below the Table 250.122 minimum is flagged.'),
  egcBare: z.boolean().optional().describe('Takeoff: the EGC (or supply-side bonding jumper) is bare; its Chapter 9 Table 8 area counts in the raceway fill (Note 8) instead of a Table 5 insulated area.'),
});
export type Conductor = z.infer<typeof conductor>;

export const busLink = z.strictObject({
  id: busLinkId,
  from: nodeId.describe('Id of the equipment on the supply (line) side.'),
  to: nodeId.describe('Id of the equipment on the load side.'),
  label: label.optional(),
});
export type BusLink = z.infer<typeof busLink>;

export const CODE_EDITIONS = [2020, 2023] as const;
export const codeEdition = z.union([z.literal(2020), z.literal(2023)]);
export type CodeEdition = z.infer<typeof codeEdition>;

export const projectSettings = z.strictObject({
  name: label.min(1, 'give the project a name'),
  codeEdition: codeEdition.default(2023).describe('NFPA 70 edition the AHJ enforces: 2020 or 2023.'),
  units: z.literal('imperial').default('imperial').describe('Imperial units (ft, A, V, kVA).'),
  /** 240.21(B)(4): manufacturing building, wall height in ft. */
  manufacturingWallHeightFt: z.number().positive().max(1000).optional().describe('240.21(B)(4): manufacturing building, wall height in ft.'),
  /** 240.21(B)(4), (C)(3): conditions of maintenance and supervision ensure only qualified persons service the system. */
  qualifiedMaintenance: z.boolean().default(false).describe('240.21(B)(4), (C)(3): conditions of maintenance and supervision ensure only qualified persons service the system.'),
  /** 240.21(C)(3): an industrial installation. */
  industrialInstallation: z.boolean().default(false).describe('240.21(C)(3): an industrial installation.'),
  voltageDropCircuitPct: z.number().positive().max(20).optional().describe('Largest voltage drop of one feeder or branch circuit, % (210.19, 215.2 informational notes: 3 %). Default 3.'),
  voltageDropTotalPct: z.number().positive().max(20).optional().describe('Largest voltage drop from the source or transformer secondary to a load, % (informational notes: 5 %). Default 5.'),
  sizingMaterials: z.array(material).min(1).max(3).optional().describe(
    'Conductor materials the sizing assistant may choose, at every size (cu, al, cu-clad-al). Not stated: copper at every size, aluminum at 1/0 AWG and larger (common practice of project specifications), and each run\'s own material.',
  ),
  faultStudyDate: z.string().min(1).max(40).optional().describe('110.24(A): date the available fault current was calculated (e.g. 2026-12-02); marked on service equipment.'),
  /**
   * 110.14(C)(1): the termination rating of a conductor that does not state its own.
   * 'listed-75': equipment listed and marked for 75 °C conductors (common practice for equipment
   * marked 60/75 °C; how files without this setting have always been read).
   * 'per-110.14(C)(1)': the code's own default, 60 °C for 14–1 AWG (circuits of 100 A or less), 75 °C above.
   */
  terminationDefault: z.enum(['listed-75', 'per-110.14(C)(1)']).default('listed-75').describe('110.14(C)(1): termination rating of a conductor that states none. listed-75 (equipment listed for 75 °C) or per-110.14(C)(1) (60 °C for 14–1 AWG, 75 °C above).'),
  preparedBy: label.optional(),
  notes: z.string().max(4000).optional(),
  makeupFtPerTermination: z.number().nonnegative().max(100).optional().describe(
    'Takeoff: wire added at each end of every conductor for makeup in the enclosure, ft (default 2 ft, common practice).',
  ),
});
export type ProjectSettings = z.infer<typeof projectSettings>;

/** 240.86: a series-rated combination the user declares from the manufacturer's tested marking; never inferred. */
export const seriesRating = z.strictObject({
  lineSideId: nodeId.describe('Id of the line-side (upstream) breaker or fuse of the tested combination.'),
  loadSideId: nodeId.describe('Id of the load-side (downstream) breaker whose own interrupting rating is lower.'),
  combinationKA: kiloAmps.describe('Interrupting rating of the combination as marked on the equipment (240.86(B)), kA.'),
  note: z.string().max(400).optional().describe('Where the marking is, e.g. the panelboard label.'),
});
export type SeriesRating = z.infer<typeof seriesRating>;

// ---- Plan review (file version 2): comments, dispositions of findings, submittal rounds. ----
// Kept in one block so the fields other work adds to the element kinds above never meet it.

/** Most characters a comment or reply may hold: a long paragraph, never a document. */
export const COMMENT_MAX_CHARS = 2000;
const reviewText = z.string().max(COMMENT_MAX_CHARS, `keep a comment to ${COMMENT_MAX_CHARS} characters; split a longer one`);
/** An ISO 8601 time or date as written by the editor (kept as text; never parsed for meaning). */
const isoTime = z.string().min(4).max(40);

export const REVIEW_ROLES = ['reviewer', 'designer'] as const;
export const reviewAuthor = z.strictObject({
  name: z.string().min(1, 'give the author a name').max(80),
  role: z.enum(REVIEW_ROLES).describe('reviewer (checks the drawing) or designer (answers for it).'),
});
export type ReviewAuthor = z.infer<typeof reviewAuthor>;

/** Where a comment sits: on an element, on a finding (by its stable id), or on an area of the drawing. */
export const commentPin = z.discriminatedUnion('on', [
  z.strictObject({ on: z.literal('node'), id: nodeId }),
  z.strictObject({ on: z.literal('conductor'), id: conductorId }),
  z.strictObject({ on: z.literal('busLink'), id: busLinkId }),
  z.strictObject({
    on: z.literal('finding'),
    findingId: z.string().min(1).max(300).describe('Stable finding id (ruleId:subject:messageId).'),
    subjectId: z.string().max(64).optional().describe('Element the finding was about when the comment was written.'),
  }),
  z.strictObject({
    on: z.literal('area'),
    x: z.number().finite(), y: z.number().finite(),
    width: z.number().nonnegative().max(1e7), height: z.number().nonnegative().max(1e7),
  }),
]);
export type CommentPin = z.infer<typeof commentPin>;

export const COMMENT_STATES = ['open', 'answered', 'closed', 'withdrawn'] as const;
export type CommentState = (typeof COMMENT_STATES)[number];

export const commentReply = z.strictObject({
  author: reviewAuthor,
  at: isoTime,
  text: reviewText.min(1, 'a reply needs some text'),
});
export type CommentReply = z.infer<typeof commentReply>;

export const reviewComment = z.strictObject({
  number: z.number().int().min(1).max(1_000_000).describe('Stable comment number; never reused.'),
  pin: commentPin,
  author: reviewAuthor,
  at: isoTime.describe('When the comment was written (ISO 8601).'),
  text: reviewText.min(1, 'a comment needs some text').describe('Plain text; never read as markup.'),
  state: z.enum(COMMENT_STATES).describe('open → answered → closed, or withdrawn.'),
  round: z.number().int().min(0).max(1000).describe('Number of the round under review when written; 0 before the first round.'),
  replies: z.array(commentReply).max(500).default([]),
});
export type ReviewComment = z.infer<typeof reviewComment>;

export const DISPOSITION_KINDS = ['ahj-accepted', 'disputed', 'deferred'] as const;
export type DispositionKind = (typeof DISPOSITION_KINDS)[number];
export const findingDisposition = z.strictObject({
  findingId: z.string().min(1).max(300).describe('Stable finding id the disposition answers.'),
  kind: z.enum(DISPOSITION_KINDS).describe('ahj-accepted (the AHJ accepts it), disputed (with a reason) or deferred (to a later round).'),
  fingerprint: z.string().min(1).max(40).describe('Fingerprint of the finding\'s severity, message and values when dispositioned.'),
  by: reviewAuthor,
  at: isoTime,
  ahjName: z.string().max(120).optional().describe('ahj-accepted: who accepted it for the AHJ.'),
  ahjDate: z.string().max(40).optional().describe('ahj-accepted: when the AHJ accepted it.'),
  reference: z.string().max(200).optional().describe('ahj-accepted: letter, permit or meeting reference.'),
  reason: reviewText.optional().describe('disputed: why; deferred: until when or what.'),
});
export type FindingDisposition = z.infer<typeof findingDisposition>;

// The element kinds appear again inside rounds: named, the JSON Schema writes each once under $defs.
for (const [s, id] of [[equipmentNode, 'Equipment'], [conductor, 'Conductor'], [busLink, 'BusLink'], [projectSettings, 'ProjectSettings']] as const) {
  if (!z.globalRegistry.has(s)) z.globalRegistry.add(s, { id });
}

/** The drawing part of a document: what a round freezes. */
export const drawingSnapshot = z.strictObject({
  project: projectSettings,
  nodes: z.array(equipmentNode).max(500_000),
  conductors: z.array(conductor).max(500_000),
  busLinks: z.array(busLink).max(500_000),
  seriesRatings: z.array(seriesRating).max(10_000).optional(),
});
export type DrawingSnapshot = z.infer<typeof drawingSnapshot>;

/** A round stored as what changed since the round before: elements added or replaced whole, ids removed. */
export const drawingChanges = z.strictObject({
  project: projectSettings.optional(),
  seriesRatings: z.array(seriesRating).max(10_000).optional().describe('The whole list, when it changed.'),
  nodes: z.array(equipmentNode).max(500_000),
  conductors: z.array(conductor).max(500_000),
  busLinks: z.array(busLink).max(500_000),
  removed: z.strictObject({
    nodes: z.array(nodeId).max(500_000),
    conductors: z.array(conductorId).max(500_000),
    busLinks: z.array(busLinkId).max(500_000),
  }),
});
export type DrawingChanges = z.infer<typeof drawingChanges>;

export const roundSummary = z.strictObject({
  edition: codeEdition,
  verdicts: z.array(z.strictObject({ id: conductorId, verdict: z.enum(VERDICTS) })).max(500_000),
  findings: z.array(z.strictObject({
    id: z.string().min(1).max(300),
    severity: z.enum(['violation', 'warning', 'needs-ahj', 'info']),
    fingerprint: z.string().min(1).max(40),
    message: z.string().max(2000),
  })).max(500_000),
});
export type RoundSummary = z.infer<typeof roundSummary>;

export const reviewRound = z.strictObject({
  number: z.number().int().min(1).max(1000).describe('1 for the first submittal, counting up.'),
  name: z.string().min(1, 'give the round a name').max(120).describe('e.g. "Submittal 1", "Resubmittal 2".'),
  date: z.string().min(4).max(40).describe('Date the round was frozen (ISO 8601).'),
  by: reviewAuthor.optional(),
  snapshot: drawingSnapshot.optional().describe('The whole drawing; the first round, or when smaller than the changes.'),
  changes: drawingChanges.optional().describe('What changed since the round before.'),
  summary: roundSummary.describe('Verdicts and findings of the frozen drawing.'),
});
export type ReviewRound = z.infer<typeof reviewRound>;

export const reviewBlock = z.strictObject({
  comments: z.array(reviewComment).max(100_000).default([]),
  dispositions: z.array(findingDisposition).max(100_000).default([]),
  rounds: z.array(reviewRound).max(1000).default([]),
});
export type ReviewBlock = z.infer<typeof reviewBlock>;
// ---- end of plan review ----

export const project = z.strictObject({
  format: z.literal(PROJECT_FORMAT).describe('Always "linewright-project".'),
  version: z.literal(PROJECT_VERSION).describe('Project file version.'),
  project: projectSettings,
  nodes: z.array(equipmentNode).max(500_000),
  conductors: z.array(conductor).max(500_000),
  busLinks: z.array(busLink).max(500_000).default([]),
  seriesRatings: z.array(seriesRating).max(10_000).optional().describe('240.86 series-rated combinations declared by the user.'),
  review: reviewBlock.optional().describe('Plan review: comments, dispositions of findings, submittal rounds (version 2).'),
});
export type Project = z.infer<typeof project>;
/** What a file may hold before defaults are filled in. */
export type ProjectInput = z.input<typeof project>;
