import { PROJECT_VERSION, project as projectSchema, type Project } from '../../../core/src/model/schema';
import { prepareContext } from '../../../core/src/analyze/context';
import { studyFaultCurrent } from '../../../core/src/studies/faultCurrent/faultCurrent';
import { studyVoltageDropAfterFault } from '../../../core/src/studies/index';

type Raw = Record<string, unknown>;

/**
 * A small radial network for the study tests: `node`, `wire` and `link`
 * append in supply-to-load order. The project passes through the zod schema
 * (defaults filled) unless `raw` is asked for, which the finite-source check
 * needs because its primary is above the 1000 V the file format accepts.
 */
export class Net {
  nodes: Raw[] = [];
  conductors: Raw[] = [];
  busLinks: Raw[] = [];
  node(id: string, kind: string, fields: Raw = {}): this {
    this.nodes.push({ id, kind, ...fields });
    return this;
  }
  wire(id: string, from: string, to: string, fields: Raw = {}): this {
    this.conductors.push({ id, from, to, material: 'cu', parallelSets: 1, insulation: 'THHN', wiring: 'steel-conduit', ambientC: 30, currentCarrying: 3, terminalTempC: 75, leavesEnclosure: false, extendsBeyondEquipment: false, outdoors: false, damageProtection: 'raceway', multioutletCordAndPlug: false, ...fields });
    return this;
  }
  link(id: string, from: string, to: string): this {
    this.busLinks.push({ id, from, to });
    return this;
  }
  project(raw = false): Project {
    const input = { format: 'linewright-project', version: PROJECT_VERSION, project: { name: 'Study test', codeEdition: 2023 }, nodes: this.nodes, conductors: this.conductors, busLinks: this.busLinks };
    return raw ? (input as unknown as Project) : projectSchema.parse(input);
  }
  study(raw = false) {
    const p = this.project(raw);
    const ctx = prepareContext(p);
    const g = ctx.graph;
    const fault = studyFaultCurrent(g, ctx.order, ctx.count);
    const drop = studyVoltageDropAfterFault(ctx, fault);
    const at = (id: string) => g.nodeIndex.get(id)!;
    const wire = (id: string) => p.conductors.findIndex((c) => c.id === id);
    return { p, g, fault, drop, kA: (id: string) => fault.kA[at(id)]!, xr: (id: string) => fault.xOverR[at(id)]!, pct: (id: string) => drop.pct[wire(id)]!, total: (id: string) => drop.totalPct[at(id)]!, circuit: (id: string) => drop.circuitPct[at(id)]! };
  }
}
