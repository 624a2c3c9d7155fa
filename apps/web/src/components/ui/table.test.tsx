// @vitest-environment happy-dom
import type { MemberRow } from '@scrap-relay/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { makeMember } from '../../testing/fixtures.ts';
import { buttonNamed, cleanup, click, render } from '../../testing/render.tsx';
import { DataTable, dataTableColumns } from './table.tsx';

afterEach(cleanup);

const column = dataTableColumns<MemberRow>();
const columns = column.columns([
  column.accessor('name', { header: 'Name', sortFn: 'text' }),
  column.accessor('joinedAt', { header: 'Joined', sortFn: 'text', sortDescFirst: true }),
  column.accessor('roles', { header: 'Roles', enableSorting: false, filterFn: 'arrIncludes', cell: ({ getValue }) => getValue().join(', ') }),
]);

// 30 members: Member 01 … Member 30, joined on consecutive days; every third one is a librarian.
const members = Array.from({ length: 30 }, (_, i) =>
  makeMember(i + 1, i % 3 === 0 ? { roles: ['member', 'librarian'] } : {}),
);

const bodyNames = (root: HTMLElement) =>
  [...root.querySelectorAll('tbody tr')].map((row) => row.querySelector('td')?.textContent?.replace(/^Name/, ''));
const status = (root: HTMLElement) => root.querySelector('[role="status"]')?.textContent;

function renderTable(props: Partial<Parameters<typeof DataTable<MemberRow>>[0]> = {}) {
  return render(
    <DataTable
      caption="Guild members"
      data={members}
      columns={columns}
      getRowId={(m) => m.id}
      initialSorting={[{ id: 'name', desc: false }]}
      noun={['member', 'members']}
      emptyMessage="Nobody matches."
      {...props}
    />,
  );
}

describe('DataTable', () => {
  it('shows 25 rows a page and pages on', async () => {
    const { container } = await renderTable();
    expect(bodyNames(container)).toHaveLength(25);
    expect(status(container)).toBe('Showing 1–25 of 30 members');

    await click(buttonNamed(container, /Next page/));

    expect(bodyNames(container)).toEqual(['Member 26', 'Member 27', 'Member 28', 'Member 29', 'Member 30']);
    expect(status(container)).toBe('Showing 26–30 of 30 members');
    expect(container.textContent).toContain('Page 2 of 2');
  });

  it('sorts from the column header and says so with aria-sort', async () => {
    const { container } = await renderTable();
    const joinedHeader = [...container.querySelectorAll('th')].find((th) => th.textContent?.startsWith('Joined'))!;

    await click(joinedHeader.querySelector('button')!);

    expect(joinedHeader.getAttribute('aria-sort')).toBe('descending');
    expect(bodyNames(container)[0]).toBe('Member 30');
  });

  it('filters by the page’s search text and by a column filter together', async () => {
    const { container } = await renderTable({
      globalFilter: 'member2',
      searchText: (m) => m.email,
      columnFilters: [{ id: 'roles', value: ['librarian'] }],
    });
    // member2… e-mails: 2 and 20–29; librarians are 1, 4, 7, …, 28 → 22, 25, 28.
    expect(bodyNames(container)).toEqual(['Member 22', 'Member 25', 'Member 28']);
    expect(status(container)).toBe('Showing 1–3 of 3 members');
  });

  it('says so when nothing matches', async () => {
    const { container } = await renderTable({ globalFilter: 'nobody by this name' });
    expect(container.querySelector('tbody')?.textContent).toBe('Nobody matches.');
    expect(status(container)).toBe('No members to show');
  });
});
