import { describe, expect, it } from 'vitest';
import { paths, safeNextPath } from './paths';

describe('paths', () => {
  it('builds links that match their router patterns', () => {
    expect(paths.invitation.href('tok/en')).toBe('/invite/tok%2Fen');
    expect(paths.adminMailMessage.href(12)).toBe('/admin/mailbox/12');
    expect(paths.signIn.href({ next: '/admin/users?x=1', notice: 'signed-out' })).toBe(
      '/sign-in?next=%2Fadmin%2Fusers%3Fx%3D1&notice=signed-out',
    );
    expect(paths.signIn.href()).toBe('/sign-in');
  });

  it('accepts only in-app destinations after sign-in', () => {
    expect(safeNextPath('/admin/users')).toBe('/admin/users');
    expect(safeNextPath('https://evil.example/')).toBe('/');
    expect(safeNextPath('//evil.example/')).toBe('/');
    expect(safeNextPath('/\\evil.example')).toBe('/');
    expect(safeNextPath('/sign-in?next=/x')).toBe('/');
    expect(safeNextPath(null)).toBe('/');
  });
});
