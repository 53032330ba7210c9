import { LIMITS } from '@sagline/common/api-types';
import { ChangePasswordDto } from '../src/auth/dto/change-password.dto';
import { ApiError } from '../src/common/api-error';
import { ApiValidationPipe } from '../src/common/validation';
import { AcceptInvitationDto } from '../src/invitations/dto/accept-invitation.dto';

/** What the global pipe answers for a body sent to a route taking `dto`: the details of its 400, or 'ok'. */
async function check(dto: new () => object, body: Record<string, unknown>): Promise<unknown> {
  try {
    await new ApiValidationPipe().transform(body, { type: 'body', metatype: dto });
    return 'ok';
  } catch (e) {
    if (e instanceof ApiError) return e.details;
    throw e;
  }
}

/** A new password is checked alike when it is changed and when an invitation is accepted (one rule, one wording). */
describe.each([
  { route: 'POST /api/auth/password', dto: ChangePasswordDto, field: 'newPassword', rest: { currentPassword: 'the old secret' } },
  { route: 'POST /api/invitations/:token/accept', dto: AcceptInvitationDto, field: 'password', rest: { name: 'Ines Okafor' } },
])('a new password on $route', ({ dto, field, rest }) => {
  it.each([
    ['missing', undefined, 'is required'],
    ['not text', 12345678901, 'must be text'],
    ['too short', 'short', `must be at least ${LIMITS.passwordMin} characters`],
    ['too long', 'x'.repeat(LIMITS.passwordMax + 1), `must be at most ${LIMITS.passwordMax} characters`],
  ])('%s: one clear problem on the field', async (_what, value, message) => {
    expect(await check(dto, { ...rest, [field]: value })).toEqual([{ path: `body.${field}`, message }]);
  });

  it('is taken at the limits', async () => {
    expect(await check(dto, { ...rest, [field]: 'x'.repeat(LIMITS.passwordMin) })).toBe('ok');
    expect(await check(dto, { ...rest, [field]: 'x'.repeat(LIMITS.passwordMax) })).toBe('ok');
  });
});
