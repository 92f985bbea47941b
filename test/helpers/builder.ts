/**
 * A small fluent builder for one-line fixtures in tests.
 *
 *   diagram().utility(480).breaker(600).tap({ size: '3/0', lengthFt: 20 }).breaker(200).build()
 *
 * Each equipment call adds a node below the current one and makes it current.
 * The new node is joined to the previous one by the conductor given with
 * `.conductor()` / `.tap()` just before it, or else by a bus link (equipment in
 * one assembly, no length). `.at(id)` moves back to a node to start a branch.
 * Ids default to `<kind><n>` for nodes and `C<n>` for conductors; pass `id`
 * to choose one. Positions are laid out top to bottom so a fixture can also
 * be opened in the editor. `build()` returns a fresh ProjectInput each time.
 */
import { PROJECT_VERSION, type ProjectInput } from '@linewright/core';

export type NodeInput = ProjectInput['nodes'][number];
export type ConductorInput = ProjectInput['conductors'][number];
export type BusLinkInput = NonNullable<ProjectInput['busLinks']>[number];
type SettingsInput = ProjectInput['project'];
type Kind = NodeInput['kind'];
type NodeOf<K extends Kind> = Extract<NodeInput, { kind: K }>;
/** Everything a node of kind K may carry, except its kind; id optional. */
export type NodeOpts<K extends Kind> = Partial<Omit<NodeOf<K>, 'kind'>>;
/** A conductor without its ends; size is the one fact that has no default. */
export type ConductorSpec = Omit<ConductorInput, 'from' | 'to' | 'id'> & { id?: string };

const X_PX = 160;
const Y_PX = 110;

export class DiagramBuilder {
  private readonly nodes: NodeInput[] = [];
  private readonly conductors: ConductorInput[] = [];
  private readonly busLinks: BusLinkInput[] = [];
  private settingsInput: SettingsInput;
  private cursor: string | null = null;
  private pending: ConductorSpec | null = null;
  private readonly depth = new Map<string, number>();
  private readonly perRow = new Map<number, number>();
  private seq = 0;
  private conductorSeq = 0;
  private readonly edgeIds = new Set<string>();

  constructor(settings: Partial<SettingsInput> = {}) {
    this.settingsInput = { name: 'Test fixture', ...settings };
  }

  /** Project settings (name, edition, high-bay and industrial facts). */
  settings(patch: Partial<SettingsInput>): this {
    this.settingsInput = { ...this.settingsInput, ...patch };
    return this;
  }

  utility(voltsLL = 480, opts: NodeOpts<'utility'> = {}): this {
    return this.add({ kind: 'utility', voltsLL, phases: 3, ...opts } as NodeInput);
  }
  generator(kva: number, opts: NodeOpts<'generator'> = {}): this {
    return this.add({ kind: 'generator', kva, voltsLL: 480, phases: 3, ...opts } as NodeInput);
  }
  /** A breaker; leave `ratingA` undefined to draw one whose rating is not known yet. */
  breaker(ratingA?: number, opts: NodeOpts<'breaker'> = {}): this {
    return this.add({ kind: 'breaker', ...(ratingA === undefined ? {} : { ratingA }), ...opts } as NodeInput);
  }
  fuse(ratingA?: number, opts: NodeOpts<'fuse'> = {}): this {
    return this.add({ kind: 'fuse', ...(ratingA === undefined ? {} : { ratingA }), ...opts } as NodeInput);
  }
  disconnect(opts: NodeOpts<'disconnect'> = {}): this {
    return this.add({ kind: 'disconnect', ...opts } as NodeInput);
  }
  splice(opts: NodeOpts<'splice'> = {}): this {
    return this.add({ kind: 'splice', ...opts } as NodeInput);
  }
  bus(busType: NodeOf<'bus'>['busType'], busRatingA?: number, opts: NodeOpts<'bus'> = {}): this {
    return this.add({ kind: 'bus', busType, ...(busRatingA === undefined ? {} : { busRatingA }), ...opts } as NodeInput);
  }
  panel(busRatingA?: number, opts: NodeOpts<'bus'> = {}): this {
    return this.bus('panelboard', busRatingA, opts);
  }
  switchboard(busRatingA?: number, opts: NodeOpts<'bus'> = {}): this {
    return this.bus('switchboard', busRatingA, opts);
  }
  tapBox(busRatingA?: number, opts: NodeOpts<'bus'> = {}): this {
    return this.bus('tap-box', busRatingA, opts);
  }
  transformer(opts: NodeOpts<'transformer'> & { kva: number }): this {
    return this.add({
      kind: 'transformer', primaryVoltsLL: 480, secondaryVoltsLL: 208, phases: 3, connection: 'delta-wye', ...opts,
    } as NodeInput);
  }
  /** A load; give exactly one of `currentA` or `kva` (default 10 A). */
  load(opts: NodeOpts<'load'> = {}): this {
    const amps = opts.currentA === undefined && opts.kva === undefined ? { currentA: 10 } : {};
    return this.add({ kind: 'load', ...amps, ...opts } as NodeInput);
  }
  /** Any node, as written in a file. */
  node(n: Omit<NodeInput, 'id'> & { id?: string }): this {
    return this.add(n as NodeInput);
  }

  /** The next equipment call joins the current node to the new one with this conductor. */
  conductor(spec: ConductorSpec): this {
    this.pending = spec;
    return this;
  }
  /** Same as `conductor`, read as "a tap conductor follows". */
  tap(spec: ConductorSpec): this {
    return this.conductor(spec);
  }

  /**
   * Join two existing nodes: by a conductor when `spec` is given, else by a bus link.
   * For loops, double feeds and other odd shapes; the current node does not change.
   */
  join(from: string, to: string, spec?: ConductorSpec): this {
    for (const id of [from, to]) if (!this.depth.has(id)) throw new Error(`builder: no node '${id}' yet`);
    if (spec) {
      const { id: cid, ...rest } = spec;
      this.pushConductor(cid, from, to, rest);
    } else {
      this.pushBusLink(from, to);
    }
    return this;
  }

  /** The next equipment call starts a new, separate tree (a second source, an island). */
  startTree(): this {
    this.cursor = null;
    this.pending = null;
    return this;
  }

  /** Make an existing node current, to draw a branch from it. */
  at(id: string): this {
    if (!this.depth.has(id)) throw new Error(`builder: no node '${id}' yet`);
    this.cursor = id;
    this.pending = null;
    return this;
  }
  /** Id of the current node. */
  here(): string {
    if (this.cursor === null) throw new Error('builder: no node yet');
    return this.cursor;
  }
  /** Id of the conductor added last. */
  lastConductor(): string {
    const c = this.conductors[this.conductors.length - 1];
    if (!c) throw new Error('builder: no conductor yet');
    return c.id;
  }

  build(): ProjectInput {
    return structuredClone({
      format: 'linewright-project',
      version: PROJECT_VERSION,
      project: this.settingsInput,
      nodes: this.nodes,
      conductors: this.conductors,
      busLinks: this.busLinks,
    }) as ProjectInput;
  }

  private pushConductor(id: string | undefined, from: string, to: string, spec: Omit<ConductorSpec, 'id'>): void {
    let cid = id;
    while (cid === undefined || this.edgeIds.has(cid)) {
      if (id !== undefined) throw new Error(`builder: duplicate conductor id '${id}'`);
      cid = `C${++this.conductorSeq}`;
    }
    this.edgeIds.add(cid);
    this.conductors.push({ id: cid, from, to, ...spec } as ConductorInput);
  }

  private pushBusLink(from: string, to: string): void {
    this.busLinks.push({ id: `BL${this.busLinks.length + 1}`, from, to } as BusLinkInput);
  }

  private add(raw: NodeInput): this {
    const id = raw.id ?? `${raw.kind}${++this.seq}`;
    if (this.depth.has(id)) throw new Error(`builder: duplicate node id '${id}'`);
    const parent = this.cursor;
    const row = parent === null ? 0 : this.depth.get(parent)! + 1;
    const col = this.perRow.get(row) ?? 0;
    this.perRow.set(row, col + 1);
    this.depth.set(id, row);
    this.nodes.push({ position: { x: col * X_PX, y: row * Y_PX }, ...raw, id } as NodeInput);
    if (parent !== null) {
      if (this.pending) {
        const { id: cid, ...spec } = this.pending;
        this.pushConductor(cid, parent, id, spec);
      } else {
        this.pushBusLink(parent, id);
      }
    }
    this.pending = null;
    this.cursor = id;
    return this;
  }
}

/** Start a fixture. */
export function diagram(settings: Partial<SettingsInput> = {}): DiagramBuilder {
  return new DiagramBuilder(settings);
}
