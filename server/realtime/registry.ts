import { TableRow } from '../db/models';
import { TableMaster, type MasterHooks } from './table-master';

/** Every table this process owns, loaded once and kept. */
export class TableRegistry {
  private masters = new Map<string, Promise<TableMaster | null>>();

  constructor(private hooks: MasterHooks) {}

  get(tableId: string): Promise<TableMaster | null> {
    let master = this.masters.get(tableId);
    if (!master) {
      master = TableRow.findByPk(tableId).then((row) => (row ? TableMaster.load(row, this.hooks) : null));
      master.catch(() => this.masters.delete(tableId));
      this.masters.set(tableId, master);
    }
    return master;
  }

  /** Loaded tables only (no database read). */
  async peek(tableId: string): Promise<TableMaster | null> {
    return (await this.masters.get(tableId)) ?? null;
  }

  /** On start: rebuild every table with an exchange under way from its stored log. */
  async restoreOpenTables(): Promise<number> {
    const rows = await TableRow.findAll({ where: { status: 'playing' } });
    for (const row of rows) {
      const master = TableMaster.load(row, this.hooks);
      this.masters.set(row.id, master);
      const loaded = await master;
      await loaded.resume();
      loaded.wakeBots();
    }
    return rows.length;
  }

  /** Stops the bots and waits until every action already queued at any table is done and stored. */
  async closeAll() {
    const masters = await Promise.all([...this.masters.values()].map((m) => m.catch(() => null)));
    for (const master of masters) master?.close();
    await Promise.all(masters.map((master) => master?.idle()));
  }
}
