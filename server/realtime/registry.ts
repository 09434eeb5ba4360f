import { TableRow } from '../db/models';
import { TableError, TableMaster, type MasterHooks } from './table-master';

const BROKEN_MESSAGE = 'This table could not be restored after a restart: its stored passes no longer add up. Its host can open a new table; finished exchanges are safe in your history.';

/** Every table this process owns, loaded once and kept. */
export class TableRegistry {
  private masters = new Map<string, Promise<TableMaster | null>>();

  constructor(private hooks: MasterHooks) {}

  get(tableId: string): Promise<TableMaster | null> {
    let master = this.masters.get(tableId);
    if (!master) {
      master = TableRow.findByPk(tableId).then((row) => (row ? TableMaster.load(row, this.hooks) : null));
      // Tried again on the next ask.
      master.catch(() => this.masters.delete(tableId));
      this.masters.set(tableId, master);
    }
    return master;
  }

  /** Loaded tables only (no database read); a table that could not be restored is not one. */
  async peek(tableId: string): Promise<TableMaster | null> {
    return (await this.masters.get(tableId)?.catch(() => null)) ?? null;
  }

  /**
   * On start: rebuild every table with an exchange under way from its stored log. A table whose log
   * no longer applies is logged and closed to its players (a join says so); the others start.
   */
  async restoreOpenTables(onBroken: (tableId: string, err: unknown) => void = () => undefined): Promise<number> {
    const rows = await TableRow.findAll({ where: { status: 'playing' } });
    let restored = 0;
    for (const row of rows) {
      try {
        const loaded = await TableMaster.load(row, this.hooks);
        this.masters.set(row.id, Promise.resolve(loaded));
        await loaded.resume();
        loaded.wakeBots();
        restored += 1;
      } catch (err) {
        this.masters.set(row.id, Promise.reject(new TableError('TABLE_BROKEN', BROKEN_MESSAGE)));
        this.masters.get(row.id)!.catch(() => undefined);
        onBroken(row.id, err);
      }
    }
    return restored;
  }

  /** Stops the bots and waits until every action already queued at any table is done and stored. */
  async closeAll() {
    const masters = await Promise.all([...this.masters.values()].map((m) => m.catch(() => null)));
    for (const master of masters) master?.close();
    await Promise.all(masters.map((master) => master?.idle()));
  }
}
