import type { MigrationParams } from 'umzug';
import type { MigrationContext } from '../db/migrate';

// The one-statement save (0030, 0059) also answers the severities of the club rules in
// force in the model's workspace, so the save's answer gives the club's counts without
// a second round trip (api/models/follow-club-rules.ts did one per save). NULL when the
// club has set no rules. The parameters are unchanged; only the answer gains a column.
const SIGNATURE =
  'uuid, uuid, text[], integer, text, text, jsonb, text, jsonb, integer, integer, integer, text, text, text, jsonb, text';

function saveRevisionFunction(withRules: boolean): string {
  const RULES_COLUMN = withRules ? ', club_severities jsonb' : '';
  const NO_RULES = withRules ? ', NULL::jsonb' : '';
  const RULES_VALUE = withRules
    ? ', (SELECT c.severities FROM club_rules c WHERE c.workspace_id = v_workspace_id)'
    : '';
  return `
    CREATE FUNCTION save_revision(
      p_model_id uuid, p_author_id uuid, p_allowed_roles text[], p_base integer, p_message text, p_yaml_text text,
      p_document jsonb, p_content_hash text, p_findings jsonb, p_error_count integer, p_warning_count integer,
      p_info_count integer, p_origin text, p_airframe text, p_audit_action text, p_audit_details jsonb, p_model_name text
    ) RETURNS TABLE (outcome text, caller_role text, revision_id uuid, revision_number integer,
                     revision_created_at timestamptz, latest_id uuid, latest_number integer${RULES_COLUMN})
    LANGUAGE plpgsql VOLATILE AS $$
    DECLARE
      v_workspace_id uuid;
      v_airframe text;
      v_name text;
      v_latest_name text;
      v_role text;
      v_latest_id uuid;
      v_latest_number integer;
      v_id uuid;
      v_created_at timestamptz;
    BEGIN
      SELECT m.workspace_id, ms.role INTO v_workspace_id, v_role
        FROM models m JOIN memberships ms ON ms.workspace_id = m.workspace_id AND ms.user_id = p_author_id
       WHERE m.id = p_model_id;
      IF NOT FOUND THEN
        RETURN QUERY SELECT 'not-found'::text, NULL::text, NULL::uuid, NULL::integer, NULL::timestamptz, NULL::uuid, NULL::integer${NO_RULES};
        RETURN;
      END IF;
      IF NOT (v_role = ANY (p_allowed_roles)) THEN
        RETURN QUERY SELECT 'role-too-low'::text, v_role, NULL::uuid, NULL::integer, NULL::timestamptz, NULL::uuid, NULL::integer${NO_RULES};
        RETURN;
      END IF;
      SELECT airframe, name INTO v_airframe, v_name FROM models WHERE id = p_model_id FOR UPDATE;
      SELECT id, number, document->'model'->>'name' INTO v_latest_id, v_latest_number, v_latest_name
        FROM revisions WHERE model_id = p_model_id ORDER BY number DESC LIMIT 1;
      IF coalesce(v_latest_number, 0) <> p_base THEN
        RETURN QUERY SELECT 'stale-base'::text, v_role, NULL::uuid, NULL::integer, NULL::timestamptz, v_latest_id,
                            coalesce(v_latest_number, 0)${NO_RULES};
        RETURN;
      END IF;
      INSERT INTO revisions (model_id, number, parent_id, author_id, message, yaml_text, document, content_hash, findings,
                             error_count, warning_count, info_count, origin, created_at)
      VALUES (p_model_id, p_base + 1, v_latest_id, p_author_id, p_message, p_yaml_text, p_document, p_content_hash,
              p_findings, p_error_count, p_warning_count, p_info_count, p_origin, clock_timestamp())
      RETURNING id, created_at INTO v_id, v_created_at;
      UPDATE models SET airframe = coalesce(p_airframe, v_airframe), updated_at = v_created_at WHERE id = p_model_id;
      IF p_audit_action IS NOT NULL THEN
        INSERT INTO audit_events (workspace_id, actor_id, action, subject_type, subject_id, details, created_at)
        VALUES (v_workspace_id, p_author_id, p_audit_action, 'revision', v_id,
                p_audit_details || jsonb_build_object('number', p_base + 1), v_created_at);
      END IF;
      IF p_model_name IS NOT NULL AND p_model_name <> v_name AND btrim(v_latest_name) = v_name THEN
        UPDATE models SET name = p_model_name WHERE id = p_model_id;
        INSERT INTO audit_events (workspace_id, actor_id, action, subject_type, subject_id, details, created_at)
        VALUES (v_workspace_id, p_author_id, 'model.renamed', 'model', p_model_id,
                jsonb_build_object('from', v_name, 'to', p_model_name, 'number', p_base + 1), v_created_at);
      END IF;
      RETURN QUERY SELECT 'saved'::text, v_role, v_id, p_base + 1, v_created_at, v_latest_id, v_latest_number${RULES_VALUE};
    END
    $$`;
}

export async function up({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`DROP FUNCTION save_revision(${SIGNATURE})`);
  await sequelize.query(saveRevisionFunction(true));
}

export async function down({ context: { sequelize } }: MigrationParams<MigrationContext>): Promise<void> {
  await sequelize.query(`DROP FUNCTION save_revision(${SIGNATURE})`);
  await sequelize.query(saveRevisionFunction(false));
}
