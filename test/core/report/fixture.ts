import {
  CAUTION,
  PROJECT_VERSION,
  SEVERITIES,
  VERDICTS,
  project as projectSchema,
  type AmpacityWorking,
  type AnalysisReport,
  type ConductorId,
  type ConductorReport,
  type Finding,
  type NodeId,
  type Project,
  type ProjectInput,
  type Severity,
  type Verdict,
} from '@linewright/core';

/**
 * A hand-built report for an invented small building, used to test the renderers without the
 * analyzer. The numbers follow NFPA 70-2023 Table 310.16 (75 °C column, Cu) so the fixture reads
 * true: 3/0 Cu = 200 A, 500 kcmil Cu = 380 A, 4 AWG Cu = 85 A, 1 AWG Cu = 130 A.
 */
export const fixtureInput: ProjectInput = {
  format: 'linewright-project',
  version: PROJECT_VERSION,
  project: { name: 'Harbor Lane Test Shop', codeEdition: 2023, preparedBy: 'R. Example, PE' },
  nodes: [
    { id: 'U1', kind: 'utility', label: 'Utility', voltsLL: 480, phases: 3, position: { x: 0, y: 0 } },
    { id: 'MSB', kind: 'bus', busType: 'switchboard', label: 'MSB', busRatingA: 800, position: { x: 0, y: 120 } },
    { id: 'CB-M', kind: 'breaker', label: 'Main', ratingA: 800, position: { x: 0, y: 60 } },
    { id: 'CB-F1', kind: 'breaker', label: 'Feeder 1', ratingA: 600, position: { x: -160, y: 200 } },
    { id: 'SP1', kind: 'splice', label: 'Tap box', position: { x: -160, y: 300 } },
    { id: 'CB-T1', kind: 'breaker', label: 'Tap main', ratingA: 200, position: { x: -240, y: 400 } },
    { id: 'LP1', kind: 'bus', busType: 'panelboard', label: 'LP-1, "north"', busRatingA: 225, position: { x: -240, y: 480 } },
    { id: 'L1', kind: 'load', label: 'Shop loads', kva: 60, position: { x: -240, y: 580 } },
    { id: 'L2', kind: 'load', label: 'Welder', currentA: 90, position: { x: -80, y: 400 } },
    { id: 'F2', kind: 'fuse', label: 'Fuse 2', ratingA: 400, position: { x: 160, y: 200 } },
    { id: 'T1', kind: 'transformer', label: 'T-1', kva: 75, primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, connection: 'delta-wye', position: { x: 160, y: 300 } },
    { id: 'DS1', kind: 'disconnect', label: 'DS-1', position: { x: 160, y: 400 } },
    { id: 'G1', kind: 'generator', label: 'Gen', voltsLL: 480, phases: 3, kva: 100, position: { x: 320, y: 0 } },
  ],
  conductors: [
    { id: 'C1', from: 'U1', to: 'CB-M', size: '500', parallelSets: 2, lengthFt: 40, label: 'Service' },
    { id: 'C2', from: 'CB-F1', to: 'SP1', size: '500', lengthFt: 50, label: 'Feeder 1' },
    { id: 'C3', from: 'SP1', to: 'CB-T1', size: '3/0', lengthFt: 20, label: 'Tap to LP-1, "north"' },
    { id: 'C4', from: 'SP1', to: 'L2', size: '4', lengthFt: 30, label: 'Welder tap' },
    { id: 'C5', from: 'CB-T1', to: 'LP1', size: '3/0', lengthFt: 5 },
    { id: 'C6', from: 'F2', to: 'T1', size: '1', label: 'T-1 primary' },
  ],
  busLinks: [
    { id: 'B1', from: 'CB-M', to: 'MSB' },
    { id: 'B2', from: 'MSB', to: 'CB-F1' },
    { id: 'B3', from: 'MSB', to: 'F2' },
    { id: 'B4', from: 'LP1', to: 'L1' },
    { id: 'B5', from: 'T1', to: 'DS1' },
  ],
};

export const fixtureProject: Project = projectSchema.parse(fixtureInput);

const cid = (s: string) => s as ConductorId;
const nid = (s: string) => s as NodeId;
const cite = (section: string) => ({ code: 'NEC' as const, edition: 2023 as const, section });

function working(baseA: number, sets = 1): AmpacityWorking {
  return {
    insulationTempC: 90,
    baseA,
    ambientFactor: 1,
    currentCarrying: 3,
    adjustmentFactor: 1,
    correctedA: baseA,
    terminalTempC: 75,
    terminalLimitA: baseA,
    perSetA: baseA,
    parallelSets: sets,
    ampacityA: baseA * sets,
    governedBy: 'terminal-rating',
    smallConductorMaxOcpdA: null,
    steps: [
      { id: 'terminal', text: `Table 310.16, Cu, 75 °C column: ${baseA} A`, value: baseA },
      { id: 'parallel', text: `${sets} set(s): ${baseA * sets} A`, value: baseA * sets },
    ],
  };
}

export function conductor(over: Partial<ConductorReport> & Pick<ConductorReport, 'id' | 'verdict'>): ConductorReport {
  return {
    label: '',
    from: nid('?'),
    to: nid('?'),
    rule: null,
    cites: null,
    role: 'feeder',
    summary: '',
    size: '3/0',
    material: 'cu',
    parallelSets: 1,
    lengthFt: null,
    ampacity: null,
    upstreamDevice: null,
    supply: { kind: 'none', id: null },
    chain: [],
    tapLengthFt: null,
    load: null,
    tried: [],
    fixes: [],
    findingIds: [],
    ...over,
  };
}

const feeder600 = { id: nid('CB-F1'), kind: 'breaker' as const, label: 'Feeder 1', ratingA: 600 };

export const fixtureFindings: Finding[] = [
  {
    id: 'tap-25ft:conductor:C4:tooSmall',
    ruleId: 'tap-25ft',
    messageId: 'tooSmall',
    severity: 'violation',
    cites: cite('240.21(B)(2)'),
    subject: { kind: 'conductor', id: cid('C4') },
    related: [{ kind: 'node', id: nid('CB-F1') }],
    message: 'Tap C4 (4 AWG Cu, 85 A) is below one third of the 600 A feeder device (200 A), and it ends at a load with no OCPD.',
    data: { ampacity: 85, feederA: 600 },
    fixes: [
      { kind: 'resize', conductorIds: [cid('C4')], size: '3/0', material: 'cu', parallelSets: 1, forRule: 'tap-25ft', label: 'use 3/0 AWG Cu (200 A) and end the tap in a single OCPD of at most 200 A' },
      { kind: 'add-ocpd', conductorId: cid('C4'), ratingA: 85, label: 'add an OCPD of at most 85 A at the tap point' },
    ],
  },
  {
    id: 'tap-25ft:conductor:C3:otherMeans',
    ruleId: 'tap-25ft',
    messageId: 'otherMeans',
    severity: 'needs-ahj',
    cites: cite('240.21(B)(2)'),
    subject: { kind: 'conductor', id: cid('C3') },
    related: [],
    message: 'Tap C3 relies on "other approved means" of protection from physical damage; the AHJ decides.',
    data: {},
    fixes: [],
  },
  {
    id: 'incomplete:conductor:C6:noLength',
    ruleId: 'incomplete',
    messageId: 'noLength',
    severity: 'warning',
    cites: null,
    subject: { kind: 'conductor', id: cid('C6') },
    related: [],
    message: 'Conductor C6 has no length; the tap rules cannot be checked. Enter lengthFt.',
    data: {},
    fixes: [{ kind: 'set-field', ref: { kind: 'conductor', id: cid('C6') }, field: 'lengthFt', value: 10, label: 'enter the conductor length (lengthFt)' }],
  },
  {
    id: 'island:node:G1:island',
    ruleId: 'island',
    messageId: 'island',
    severity: 'info',
    cites: null,
    subject: { kind: 'node', id: nid('G1') },
    related: [],
    message: 'Generator G1 is not connected to anything.',
    data: {},
    fixes: [],
  },
];

export const fixtureConductors: ConductorReport[] = [
  conductor({ id: cid('C1'), label: 'Service', from: nid('U1'), to: nid('CB-M'), verdict: 'service', rule: 'service', cites: cite('240.21(D)'), role: 'service', summary: 'service conductors, protected at their load end', size: '500', parallelSets: 2, lengthFt: 40, ampacity: working(380, 2), supply: { kind: 'utility', id: nid('U1') } }),
  conductor({ id: cid('C2'), label: 'Feeder 1', from: nid('CB-F1'), to: nid('SP1'), verdict: 'protected', rule: 'protected', cites: cite('240.4'), summary: '600 A device, 380 A conductor?', size: '500', lengthFt: 50, ampacity: working(380), upstreamDevice: feeder600, supply: { kind: 'ocpd', id: nid('CB-F1') } }),
  conductor({
    id: cid('C3'),
    label: 'Tap to LP-1, "north"',
    from: nid('SP1'),
    to: nid('CB-T1'),
    verdict: 'tap-25ft',
    rule: 'tap-25ft',
    cites: cite('240.21(B)(2)'),
    summary: '200 A is at least 600/3 A, 20 ft, ends in a 200 A breaker',
    lengthFt: 20,
    tapLengthFt: 20,
    ampacity: working(200),
    upstreamDevice: feeder600,
    supply: { kind: 'ocpd', id: nid('CB-F1') },
    load: { flowingA: 72, calculatedA: 90 },
    findingIds: ['tap-25ft:conductor:C3:otherMeans'],
    tried: [
      { ruleId: 'protected', title: 'Protected at its ampacity', cites: cite('240.4'), outcome: 'fails', conditions: [{ id: 'ratingWithinAmpacity', status: 'fail', text: '600 A device exceeds 200 A ampacity', data: {} }] },
      {
        ruleId: 'tap-25ft',
        title: 'Feeder tap up to 25 ft',
        cites: cite('240.21(B)(2)'),
        outcome: 'holds',
        conditions: [
          { id: 'length', status: 'pass', text: 'tap is 20 ft, at most 25 ft', data: { lengthFt: 20 } },
          { id: 'oneThird', status: 'pass', text: '200 A is at least 600 A / 3 = 200 A', data: { ampacity: 200, feederA: 600 } },
        ],
      },
    ],
  }),
  conductor({
    id: cid('C4'),
    label: 'Welder tap',
    from: nid('SP1'),
    to: nid('L2'),
    verdict: 'unprotected',
    role: 'feeder',
    summary: 'no rule fits: 85 A is below 600/3 A and there is no OCPD at the end',
    size: '4',
    lengthFt: 30,
    tapLengthFt: 30,
    ampacity: working(85),
    upstreamDevice: feeder600,
    supply: { kind: 'ocpd', id: nid('CB-F1') },
    load: { flowingA: 90, calculatedA: 90 },
    findingIds: ['tap-25ft:conductor:C4:tooSmall'],
    fixes: fixtureFindings[0]!.fixes,
  }),
  conductor({ id: cid('C5'), from: nid('CB-T1'), to: nid('LP1'), verdict: 'protected-next-size', rule: 'protected-next-size', cites: cite('240.4(B)'), summary: '200 A device on 200 A conductor', lengthFt: 5, ampacity: working(200), upstreamDevice: { id: nid('CB-T1'), kind: 'breaker', label: 'Tap main', ratingA: 200 }, supply: { kind: 'ocpd', id: nid('CB-T1') } }),
  conductor({ id: cid('C6'), label: 'T-1 primary', from: nid('F2'), to: nid('T1'), verdict: 'incomplete', role: 'transformer-primary', summary: 'length missing', size: '1', ampacity: working(130), upstreamDevice: { id: nid('F2'), kind: 'fuse', label: 'Fuse 2', ratingA: 400 }, supply: { kind: 'ocpd', id: nid('F2') }, findingIds: ['incomplete:conductor:C6:noLength'] }),
];

function counts(conductors: ConductorReport[], findings: Finding[]): AnalysisReport['counts'] {
  const byVerdict = Object.fromEntries(VERDICTS.map((v) => [v, 0])) as Record<Verdict, number>;
  for (const c of conductors) byVerdict[c.verdict]++;
  const bySeverity = Object.fromEntries(SEVERITIES.map((s) => [s, 0])) as Record<Severity, number>;
  for (const f of findings) bySeverity[f.severity]++;
  return { conductors: conductors.length, byVerdict, bySeverity };
}

export const fixtureReport: AnalysisReport = {
  format: 'linewright-analysis',
  version: 1,
  projectName: 'Harbor Lane Test Shop',
  edition: 2023,
  assumptions: ['Terminations are rated 75 °C unless a conductor says otherwise (110.14(C)).', 'Ambient 30 °C where not given.'],
  caution: CAUTION,
  conductors: fixtureConductors,
  findings: fixtureFindings,
  counts: counts(fixtureConductors, fixtureFindings),
};

/** The same building with nothing wrong: for the "clean" paths. */
export const cleanReport: AnalysisReport = {
  ...fixtureReport,
  conductors: fixtureConductors.filter((c) => c.verdict !== 'unprotected' && c.verdict !== 'incomplete').map((c) => ({ ...c, findingIds: [] })),
  findings: [],
  counts: counts(fixtureConductors.filter((c) => c.verdict !== 'unprotected' && c.verdict !== 'incomplete'), []),
};

/**
 * A synthetic riser without positions: one utility, a switchboard, `feeders` breakers each feeding
 * a panel with `branches` branch breakers and loads. Used for pagination and layout at scale.
 */
export function syntheticRiser(feeders: number, branches: number): { project: Project; report: AnalysisReport } {
  const nodes: ProjectInput['nodes'] = [
    { id: 'U', kind: 'utility', voltsLL: 480, phases: 3 },
    { id: 'M', kind: 'breaker', ratingA: 2000 },
    { id: 'SWB', kind: 'bus', busType: 'switchboard' },
  ];
  const conductors: ProjectInput['conductors'] = [{ id: 'S', from: 'U', to: 'M', size: '500', parallelSets: 6, lengthFt: 30 }];
  const busLinks: NonNullable<ProjectInput['busLinks']> = [{ id: 'BL', from: 'M', to: 'SWB' }];
  for (let f = 0; f < feeders; f++) {
    nodes.push({ id: `F${f}`, kind: 'breaker', ratingA: 225 }, { id: `P${f}`, kind: 'bus', busType: 'panelboard' });
    busLinks.push({ id: `BF${f}`, from: 'SWB', to: `F${f}` });
    conductors.push({ id: `CF${f}`, from: `F${f}`, to: `P${f}`, size: '4/0', lengthFt: 80 + f });
    for (let b = 0; b < branches; b++) {
      nodes.push({ id: `B${f}.${b}`, kind: 'breaker', ratingA: 20 }, { id: `L${f}.${b}`, kind: 'load', currentA: 12 });
      busLinks.push({ id: `BB${f}.${b}`, from: `P${f}`, to: `B${f}.${b}` });
      conductors.push({ id: `CB${f}.${b}`, from: `B${f}.${b}`, to: `L${f}.${b}`, size: '12', lengthFt: 40 });
    }
  }
  const project = projectSchema.parse({ format: 'linewright-project', version: PROJECT_VERSION, project: { name: 'Synthetic riser' }, nodes, conductors, busLinks });
  const reports = project.conductors.map((c, i) =>
    conductor({
      id: c.id,
      from: c.from,
      to: c.to,
      verdict: i % 50 === 7 ? 'unprotected' : 'protected',
      rule: i % 50 === 7 ? null : 'protected',
      cites: i % 50 === 7 ? null : cite('240.4'),
      role: c.size === '12' ? 'branch' : 'feeder',
      size: c.size,
      parallelSets: c.parallelSets,
      lengthFt: c.lengthFt ?? null,
      ampacity: working(c.size === '12' ? 25 : 230),
      findingIds: i % 50 === 7 ? [`unprotected:conductor:${c.id}:noRule`] : [],
    }),
  );
  const findings: Finding[] = reports
    .filter((c) => c.verdict === 'unprotected')
    .map((c) => ({
      id: `unprotected:conductor:${c.id}:noRule`,
      ruleId: 'unprotected',
      messageId: 'noRule',
      severity: 'violation' as const,
      cites: cite('240.4'),
      subject: { kind: 'conductor' as const, id: c.id },
      related: [],
      message: `Conductor ${c.id} is not protected at its ampacity and meets no tap rule.`,
      data: {},
      fixes: [],
    }));
  return {
    project,
    report: { ...fixtureReport, projectName: 'Synthetic riser', conductors: reports, findings, counts: counts(reports, findings) },
  };
}
