import { QueryTypes, type Sequelize } from 'sequelize';
import bcrypt from 'bcryptjs';
import demo from '../../db/seeders/demo-sign-ins.json';

/** Password of every person this fixture adds. */
export const FIXTURE_PASSWORD = 'fixture-password-01';

/**
 * Adds, beside the demo scenario, the people and grants the access matrix needs: a second support desk with
 * a live grant on the cabin and an expired one on the van, a third whose grant on the van was revoked, and
 * another owner with a boat serviced by the second company. All invented.
 */
export async function addAccessFixture(sequelize: Sequelize) {
  const q = async <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const hash = await bcrypt.hash(FIXTURE_PASSWORD, 4);
  const id = async (sql: string, r: Record<string, unknown>) => (await q<{ id: string }>(sql, r))[0].id;
  const company = (name: string) => id('INSERT INTO companies (name) VALUES (:name) RETURNING id', { name });
  const user = (email: string, roles: string[], companyId: string | null) =>
    id(
      `INSERT INTO users (email, display_name, password_hash, roles, company_id)
       VALUES (:email, :email, :hash, ARRAY[:roles]::text[], :companyId) RETURNING id`,
      { email, hash, roles, companyId },
    );
  const [van] = await q<{ id: string; owner_id: string }>(
    `SELECT id, owner_id FROM systems WHERE name LIKE 'Winter van%'`,
  );
  const [cabin] = await q<{ id: string }>(`SELECT id FROM systems WHERE name = 'Lakeside cabin'`);
  const ownerId = van.owner_id;
  const desk = await company('Saltmarsh Support Desk');
  const thirdDesk = await company('Ridgeway Help Line');
  const deskSupport = await user('agent@saltmarsh.example', ['support'], desk);
  await user('fitter@saltmarsh.example', ['installer'], desk);
  await user('agent@ridgeway.example', ['support'], thirdDesk);
  // Someone the matrix's grant-creating cases grant to, so they change nobody else's access.
  await user('bystander@elsewhere.example', ['support'], null);
  const otherOwner = await user('skipper@boat.example', ['owner'], null);
  const boat = await id(
    `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id, installer_company_id)
     VALUES ('Sloop “Tern”', 'boat', 'agm', 12, 220, 110, :otherOwner, :desk) RETURNING id`,
    { otherOwner, desk },
  );
  const grant = (
    systemId: string,
    to: { user?: string; company?: string },
    access: string,
    expires: string,
    revoked = false,
  ) =>
    q(
      `INSERT INTO grants (system_id, grantee_user_id, grantee_email, grantee_company_id, access, granted_by, expires_at, revoked_at)
       VALUES (:systemId, :userId, (SELECT email FROM users WHERE id = :userId), :companyId, :access, :ownerId,
         now() + :expires::interval, ${revoked ? 'now()' : 'NULL'}) RETURNING id`,
      { systemId, userId: to.user ?? null, companyId: to.company ?? null, access, ownerId, expires },
    );
  await grant(cabin.id, { user: deskSupport }, 'configure', '7 days');
  await grant(van.id, { company: desk }, 'view', '-1 hour');
  await grant(van.id, { company: thirdDesk }, 'view', '7 days', true);
  return { systems: { van: van.id, cabin: cabin.id, boat }, demoPassword: demo.password };
}
