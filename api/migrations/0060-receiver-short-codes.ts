import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// A short code per unit, printed on its label beside the QR code and typed into the
// shelf's search when the code cannot be scanned. Six characters from an alphabet
// without look-alikes (no 0/O, 1/I/L, U/V), unique within the workspace. A trigger
// fills it on every insert (the shelf, the demo seed, imports), so no path can create
// a unit without one; units already on a shelf are given theirs here.
export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql(`ALTER TABLE receivers ADD COLUMN short_code text CHECK (short_code ~ '^[2-9A-HJKMNP-TW-Z]{6}$')`);
    await sql(`
      CREATE FUNCTION receiver_short_code(workspace uuid) RETURNS text LANGUAGE plpgsql VOLATILE AS $$
      DECLARE
        alphabet constant text := '23456789ABCDEFGHJKMNPQRSTWXYZ';
        code text;
      BEGIN
        LOOP
          code := '';
          FOR i IN 1..6 LOOP
            code := code || substr(alphabet, 1 + floor(random() * length(alphabet))::int, 1);
          END LOOP;
          EXIT WHEN NOT EXISTS (SELECT 1 FROM receivers WHERE workspace_id = workspace AND short_code = code);
        END LOOP;
        RETURN code;
      END $$`);
    await sql(`
      CREATE FUNCTION receivers_fill_short_code() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.short_code IS NULL THEN
          NEW.short_code := receiver_short_code(NEW.workspace_id);
        END IF;
        RETURN NEW;
      END $$`);
    await sql(`
      CREATE TRIGGER receivers_short_code BEFORE INSERT ON receivers
      FOR EACH ROW EXECUTE FUNCTION receivers_fill_short_code()`);
    // One row at a time, so each code is checked against the ones given before it.
    await sql(`
      DO $$
      DECLARE unit record;
      BEGIN
        FOR unit IN SELECT id, workspace_id FROM receivers WHERE short_code IS NULL ORDER BY created_at, id LOOP
          UPDATE receivers SET short_code = receiver_short_code(unit.workspace_id) WHERE id = unit.id;
        END LOOP;
      END $$`);
    await sql(`ALTER TABLE receivers ALTER COLUMN short_code SET NOT NULL`);
    await sql(`CREATE UNIQUE INDEX receivers_workspace_short_code ON receivers (workspace_id, short_code)`);
  });
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const sql = (text: string) => sequelize.query(text, { transaction });
    await sql('DROP TRIGGER receivers_short_code ON receivers');
    await sql('DROP FUNCTION receivers_fill_short_code()');
    await sql('DROP FUNCTION receiver_short_code(uuid)');
    await sql('ALTER TABLE receivers DROP COLUMN short_code');
  });
}
