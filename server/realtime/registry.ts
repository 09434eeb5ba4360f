import { TableError, TableMaster, type MasterHooks } from './table-master';
import { sequelizeTableStore, type TableStore } from './table-store';

const BROKEN_MESSAGE = 'This table could not be restored after a restart: its stored passes no longer add up. Its host can open a new table; finished exchanges are safe in your history.';

/** Every table this process owns, loaded once and kept. */
export class TableRegistry {
  private masters = new Map<string, Promise<TableMaster | null>>();
  private readonly store: TableStore;
  private readonly hooks: MasterHooks;

  /** Without a store in `hooks`, tables are kept in the app's database (exchange events through `hooks.events`). */
  constructor(hooks: MasterHooks) {
    this.store = hooks.store ?? sequelizeTableStore(hooks.events);
    this.hooks = { ...hooks, store: this.store };
  }

  get(tableId: string): Promise<TableMaster | null> {
    let master = this.masters.get(tableId);
    if (master) void master.then((m) => m && (m.lastUsed = Date.now())).catch(() => undefined);
    if (!master) {
      master = this.store.table(tableId).then(async (row) => {
        if (!row) return null;
        const loaded = await TableMaster.load(row, this.hooks);
        if (row.status === 'playing') {
          // Read back after leaving memory: finish what is due and let its bots move again.
          await loaded.resume();
          loaded.wakeBots();
        }
        return loaded;
      });
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
    const rows = await this.store.openTables();
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

  /** How many tables this process holds in memory. */
  get size(): number {
    return this.masters.size;
  }

  /**
   * Lets tables that are quiet (see TableMaster.quiet) and unused for `idleMs` leave memory; the
   * next ask reads them back from the database, bots and all. Returns how many left.
   */
  async sweep(idleMs: number, now = Date.now()): Promise<number> {
    let evicted = 0;
    for (const [id, pending] of [...this.masters]) {
      const master = await pending.catch(() => undefined);
      if (master === undefined) continue; // a table that could not be restored stays closed
      if (master && (!master.quiet || now - master.lastUsed < idleMs)) continue;
      if (this.masters.get(id) !== pending) continue;
      master?.close();
      this.masters.delete(id);
      evicted += 1;
    }
    return evicted;
  }

  /** Sweeps every `everyMs` until closed. */
  sweepEvery(everyMs: number, idleMs: number, onError: (err: unknown) => void) {
    const timer = setInterval(() => void this.sweep(idleMs).catch(onError), everyMs);
    timer.unref();
    this.stopSweeping = () => clearInterval(timer);
  }

  private stopSweeping = () => undefined as void;

  /** Stops the bots and waits until every action already queued at any table is done and stored. */
  async closeAll() {
    this.stopSweeping();
    const masters = await Promise.all([...this.masters.values()].map((m) => m.catch(() => null)));
    for (const master of masters) master?.close();
    await Promise.all(masters.map((master) => master?.idle()));
  }
}
