import fs from 'node:fs';
import path from 'node:path';
import { STAFF_LINKS, STAFF_PREFIXES, linksFor } from '@/lib/auth/staff-nav';
import { POLICY } from '@/lib/auth/policy';

// The proxy sends signed-out visitors away from staff pages by prefix, and takes the prefixes from
// the staff navigation. These checks keep the two lists one: every staff page folder is covered,
// every prefix is a real folder, each link names the permission its page checks, and the navigation
// stays free of server-only code (the proxy imports it).
const APP = path.resolve(__dirname, '../../../src/app');
const NON_STAFF_GROUPS = ['(public)', '(sign-in)'];

const groups = fs
  .readdirSync(APP, { withFileTypes: true })
  .filter((e) => e.isDirectory() && /^\(.+\)$/.test(e.name))
  .map((e) => e.name);
const staffGroups = groups.filter((g) => !NON_STAFF_GROUPS.includes(g));

function hasPage(dir: string): boolean {
  return fs
    .readdirSync(dir, { withFileTypes: true })
    .some((e) => (e.isDirectory() ? hasPage(path.join(dir, e.name)) : /^page\.tsx?$/.test(e.name)));
}

/** '/catalogue' for every top-level folder with a page somewhere below it, in the given groups. */
function topFolders(inGroups: string[]): string[] {
  return inGroups.flatMap((group) =>
    fs
      .readdirSync(path.join(APP, group), { withFileTypes: true })
      .filter((e) => e.isDirectory() && hasPage(path.join(APP, group, e.name)))
      .map((e) => `/${e.name}`),
  );
}

const covered = (p: string) => STAFF_PREFIXES.some((prefix) => p === prefix || p.startsWith(`${prefix}/`));

describe('staff prefixes (the proxy’s first gate)', () => {
  it('finds the staff route groups and their pages (the walk itself works)', () => {
    expect(staffGroups).toContain('(staff)');
    expect(topFolders(staffGroups)).toEqual(expect.arrayContaining(['/dashboard', '/catalogue', '/reports']));
  });

  it('covers every staff page folder', () => {
    expect(topFolders(staffGroups).filter((folder) => !covered(folder))).toEqual([]);
  });

  it('names only folders that exist in a staff group, and none of the public ones', () => {
    const staff = new Set(topFolders(staffGroups));
    expect(STAFF_PREFIXES.filter((prefix) => !staff.has(prefix))).toEqual([]);
    expect(topFolders(groups.filter((g) => NON_STAFF_GROUPS.includes(g))).filter(covered)).toEqual([]);
  });

  it('gives each link the permission its page checks', () => {
    const mismatched = STAFF_LINKS.flatMap((link) => {
      const page = staffGroups.map((g) => path.join(APP, g, link.href, 'page.tsx')).find((f) => fs.existsSync(f));
      if (!page) return [`${link.href}: no page`];
      const checks = [...fs.readFileSync(page, 'utf8').matchAll(/requireAccessForPage\('([^']+)'\)/g)].map((m) => m[1]);
      return checks.length === 1 && checks[0] === link.permission
        ? []
        : [`${link.href}: link says ${link.permission}, page checks ${checks.join(', ') || 'nothing'}`];
    });
    expect(mismatched).toEqual([]);
  });

  it('shows each role exactly the links its permissions open', () => {
    expect(linksFor('tech').map((l) => l.href)).toEqual(
      STAFF_LINKS.filter((l) => (POLICY[l.permission] as readonly string[]).includes('tech')).map((l) => l.href),
    );
    expect(linksFor('tech').map((l) => l.href)).not.toContain('/reports');
    expect(linksFor('manager')).toHaveLength(STAFF_LINKS.length);
  });

  it('keeps the navigation free of server-only code: it imports only the policy table and the roles', () => {
    const seen = new Set<string>();
    const outside: string[] = [];
    const visit = (file: string) => {
      if (seen.has(file)) return;
      seen.add(file);
      for (const [, spec] of fs.readFileSync(file, 'utf8').matchAll(/^import[^'"]*['"]([^'"]+)['"]/gm)) {
        if (!spec.startsWith('.')) outside.push(`${path.basename(file)} → ${spec}`);
        else visit(path.resolve(path.dirname(file), `${spec}.ts`));
      }
    };
    visit(path.resolve(APP, '../lib/auth/staff-nav.ts'));
    expect(outside).toEqual([]);
    expect([...seen].map((f) => path.basename(f)).sort()).toEqual(['policy.ts', 'roles.ts', 'staff-nav.ts']);
  });
});
