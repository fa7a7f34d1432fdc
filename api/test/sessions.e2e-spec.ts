import type { INestApplication } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema, MeResponseSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, TEST_PASSWORD, type TestMember, type TestOrganisation } from './utils/test-organisation.js';

/**
 * Tokens follow the member's current state: every request loads the user and the session behind
 * the token, so a role change, a deletion, a deactivation or a sign-out applies to the next request.
 */
describe('tokens follow the current user and session (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let database: DataSource;

  beforeAll(async () => {
    app = await createTestApp();
    database = app.get(DataSource);
  });

  afterAll(async () => {
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const site = { name: 'Pier roof', latitudeDeg: 53.4, longitudeDeg: -3.0, groundElevationM: 8, mountHeightM: 15 };

  async function signInAgain(member: TestMember): Promise<string> {
    const response = await http().post('/api/auth/login').send({ email: member.email, password: TEST_PASSWORD }).expect(200);
    return response.body.accessToken as string;
  }

  function expectSignInRequired(response: request.Response) {
    expect(response.status).toBe(401);
    expect(ErrorBodySchema.parse(response.body)).toMatchObject({ statusCode: 401, error: 'Unauthorized' });
  }

  describe('with a fresh organisation per test', () => {
    beforeAll(async () => {
      org = await createTestOrganisation(app, 'sessions');
    });
    afterAll(async () => {
      await org?.remove();
    });

    it('applies a role change to the next request: a demoted engineer is refused a write at once', async () => {
      const engineer = org.members.engineer;
      await http().post('/api/sites').set(...bearer(engineer)).send(site).expect(201);
      await database.query(`UPDATE app_user SET role = 'installer' WHERE id = $1`, [engineer.id]);

      const refused = await http().post('/api/sites').set(...bearer(engineer)).send(site).expect(403);
      expect(ErrorBodySchema.parse(refused.body).error).toBe('Forbidden');
      const me = MeResponseSchema.parse((await http().get('/api/auth/me').set(...bearer(engineer)).expect(200)).body);
      expect(me.role).toBe('installer');
    });

    it('applies a promotion at once too: an installer made engineer may write with the same token', async () => {
      const installer = org.members.installer;
      await http().post('/api/sites').set(...bearer(installer)).send(site).expect(403);
      await database.query(`UPDATE app_user SET role = 'engineer' WHERE id = $1`, [installer.id]);
      await http().post('/api/sites').set(...bearer(installer)).send(site).expect(201);
    });

    it('answers 401 to a deactivated member, and refuses their sign-in', async () => {
      const reviewer = org.members.reviewer;
      await http().get('/api/sites').set(...bearer(reviewer)).expect(200);
      await database.query('UPDATE app_user SET deactivated_at = now() WHERE id = $1', [reviewer.id]);

      expectSignInRequired(await http().get('/api/sites').set(...bearer(reviewer)));
      expectSignInRequired(await http().get('/api/auth/me').set(...bearer(reviewer)));
      const signIn = await http().post('/api/auth/login').send({ email: reviewer.email, password: TEST_PASSWORD }).expect(403);
      expect(signIn.body).toEqual({ statusCode: 403, error: 'Forbidden', message: 'This account has been deactivated. Ask an administrator of your organisation.' });
      // a wrong password still gets the one message for every failure, so deactivation does not leak
      await http().post('/api/auth/login').send({ email: reviewer.email, password: 'not-it' }).expect(401);
    });
  });

  it("answers 401 to a deleted user's token on reads and writes (creating a link is no longer a 500)", async () => {
    const gone = await createTestOrganisation(app, 'deleted');
    try {
      const engineer = gone.members.engineer;
      await http().get('/api/sites').set(...bearer(engineer)).expect(200);
      await database.query('DELETE FROM app_user WHERE id = $1', [engineer.id]);

      expectSignInRequired(await http().get('/api/sites').set(...bearer(engineer)));
      expectSignInRequired(await http().get('/api/links').set(...bearer(engineer)));
      expectSignInRequired(await http().post('/api/sites').set(...bearer(engineer)).send(site));
      expectSignInRequired(await http().post('/api/links').set(...bearer(engineer)).send({ name: 'Orphan', design: workedExampleDesign() }));
    } finally {
      await gone.remove();
    }
  });

  describe('sign-out and ending sessions', () => {
    let team: TestOrganisation;
    beforeAll(async () => {
      team = await createTestOrganisation(app, 'signout');
    });
    afterAll(async () => {
      await team?.remove();
    });

    it('ends the token on POST /api/auth/logout (204) and leaves the member’s other sessions alone', async () => {
      const engineer = team.members.engineer;
      const otherSession = await signInAgain(engineer);
      await http().post('/api/auth/logout').set(...bearer(engineer)).expect(204);

      expectSignInRequired(await http().get('/api/auth/me').set(...bearer(engineer)));
      expectSignInRequired(await http().post('/api/sites').set(...bearer(engineer)).send(site));
      // signing out twice with the same token: the session is already over
      expectSignInRequired(await http().post('/api/auth/logout').set(...bearer(engineer)));
      await http().get('/api/auth/me').set('Authorization', `Bearer ${otherSession}`).expect(200);
    });

    it('needs a token to sign out', async () => {
      expectSignInRequired(await http().post('/api/auth/logout'));
    });

    it('ends every session of a member through SessionsService.revokeAllForUser, optionally keeping one', async () => {
      const admin = team.members.admin;
      const second = await signInAgain(admin);
      const third = await signInAgain(admin);
      const jwt = app.get(JwtService);
      const keep = jwt.decode<{ sid: string }>(third).sid;

      // imported here so the other tests of this file run even where the service does not exist
      const { SessionsService } = await import('../src/auth/sessions.service.js');
      const sessions = app.get(SessionsService);
      expect(await sessions.revokeAllForUser(admin.id, { exceptSessionId: keep })).toBe(2);
      expectSignInRequired(await http().get('/api/auth/me').set(...bearer(admin)));
      expectSignInRequired(await http().get('/api/auth/me').set('Authorization', `Bearer ${second}`));
      await http().get('/api/auth/me').set('Authorization', `Bearer ${third}`).expect(200);

      expect(await sessions.revokeAllForUser(admin.id)).toBe(1);
      expectSignInRequired(await http().get('/api/auth/me').set('Authorization', `Bearer ${third}`));
      // a new sign-in starts a new session
      const fresh = await signInAgain(admin);
      await http().get('/api/auth/me').set('Authorization', `Bearer ${fresh}`).expect(200);
    });

    it('refuses a correctly signed token that has no session behind it', async () => {
      const installer = team.members.installer;
      const jwt = app.get(JwtService);
      const claims = jwt.decode<{ sub: string; org: string; role: string; sid: string }>(installer.token);
      // as tokens were minted before sessions existed: no sid
      const withoutSession = jwt.sign({ sub: claims.sub, org: claims.org, role: 'admin' });
      expectSignInRequired(await http().get('/api/auth/me').set('Authorization', `Bearer ${withoutSession}`));
      // an unknown session id
      const unknownSession = jwt.sign({ sub: claims.sub, org: claims.org, role: 'admin', sid: '00000000-0000-4000-8000-000000000000' });
      expectSignInRequired(await http().get('/api/auth/me').set('Authorization', `Bearer ${unknownSession}`));
      // another member's session under this member's id
      const othersSid = jwt.decode<{ sid: string }>(team.members.reviewer.token).sid;
      const borrowed = jwt.sign({ sub: claims.sub, org: claims.org, role: 'installer', sid: othersSid });
      expectSignInRequired(await http().get('/api/auth/me').set('Authorization', `Bearer ${borrowed}`));
      // a session past its end in the database, although the token itself has not expired
      await database.query(`UPDATE user_session SET expires_at = now() - interval '1 second' WHERE id = $1`, [claims.sid]);
      expectSignInRequired(await http().get('/api/auth/me').set(...bearer(installer)));
    });

    it('records each sign-in as a session of the user with its end time', async () => {
      const reviewer = team.members.reviewer;
      const sid = app.get(JwtService).decode<{ sid: string; exp: number }>(reviewer.token);
      const rows: Array<{ user_id: string; expires_at: Date; revoked_at: Date | null }> = await database.query(
        'SELECT user_id, expires_at, revoked_at FROM user_session WHERE id = $1',
        [sid.sid],
      );
      expect(rows).toHaveLength(1);
      expect(rows[0]).toMatchObject({ user_id: reviewer.id, revoked_at: null });
      // the session ends when the token does (to the second)
      expect(Math.abs(rows[0].expires_at.getTime() / 1000 - sid.exp)).toBeLessThanOrEqual(1);
    });
  });
});
