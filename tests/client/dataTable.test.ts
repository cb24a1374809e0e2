// The house table: its paging settings reach Quasar's q-table, and given `selected`, its rows are picked with
// a click, Enter or Space and say which one is selected.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { h } from 'vue';
import { QTable, type QTableColumn } from 'quasar';
import DataTable from '@/components/common/DataTable.vue';

// Invented rows: three columns of a small steel order.
interface Item {
  id: string;
  name: string;
  mass: number;
}
const rows: Item[] = [
  { id: 'a', name: 'Bracket', mass: 12.5 },
  { id: 'b', name: 'Cleat', mass: 3.24 },
  { id: 'c', name: 'Angle', mass: 40 },
];
const columns: QTableColumn<Item>[] = [
  { name: 'name', label: 'Name', field: 'name', align: 'left', sortable: true },
  { name: 'mass', label: 'Mass (kg)', field: 'mass', align: 'right', format: (v: number) => v.toFixed(1) },
];

const ItemTable = DataTable<Item, string>;
const bodyRows = (w: ReturnType<typeof mount>) => w.findAll('tbody tr');
const names = (w: ReturnType<typeof mount>) => bodyRows(w).map((r) => r.find('td').text());

describe('data table', () => {
  it('shows every row with no pagination bar when given no page size', () => {
    const w = mount(ItemTable, { props: { rows, columns, rowKey: 'id' } });
    expect(bodyRows(w)).toHaveLength(3);
    expect(w.find('.q-table__bottom').exists()).toBe(false);
    expect(w.findComponent(QTable).props('pagination')).toMatchObject({ rowsPerPage: 0 });
    expect(w.findComponent(QTable).props('hidePagination')).toBe(true);
  });

  it('is flat and bordered, unless told the card around it draws the edge', () => {
    const plain = mount(ItemTable, { props: { rows, columns, rowKey: 'id' } }).findComponent(QTable);
    expect([plain.props('flat'), plain.props('bordered')]).toEqual([true, true]);
    expect(plain.classes()).toContain('q-table--bordered');
    const inCard = mount(ItemTable, { props: { rows, columns, rowKey: 'id', bordered: false } }).findComponent(QTable);
    expect(inCard.props('bordered')).toBe(false);
    expect(inCard.classes()).not.toContain('q-table--bordered');
  });

  it('pages and sorts as told, with the house choice of page sizes', () => {
    const w = mount(ItemTable, {
      props: { rows, columns, rowKey: 'id', pageSize: 2, sortBy: 'name', descending: true },
    });
    const table = w.findComponent(QTable);
    expect(table.props('pagination')).toEqual({ rowsPerPage: 2, sortBy: 'name', descending: true });
    expect(table.props('rowsPerPageOptions')).toEqual([10, 25, 50, 100, 0]);
    expect(table.props('hidePagination')).toBe(false);
    expect(names(w)).toEqual(['Cleat', 'Bracket']);
    expect(w.find('.q-table__bottom').text()).toContain('1–2 of 3');
  });

  it('passes the q-table slots it does not draw itself on to q-table', () => {
    const w = mount(ItemTable, {
      props: { rows, columns, rowKey: 'id' },
      slots: { 'body-cell-name': (p) => h('td', { 'data-test': 'own-cell' }, p.row.name.toUpperCase()) },
    });
    expect(w.findAll('[data-test="own-cell"]').map((c) => c.text())).toEqual(['BRACKET', 'CLEAT', 'ANGLE']);
    const empty = mount(ItemTable, {
      props: { rows: [], columns, rowKey: 'id' },
      slots: { 'no-data': () => h('span', { 'data-test': 'nothing' }, 'Nothing ordered') },
    });
    expect(empty.find('[data-test="nothing"]').text()).toBe('Nothing ordered');
  });

  it('draws plain q-table rows, neither focusable nor selectable, when not given `selected`', async () => {
    const w = mount(ItemTable, { props: { rows, columns, rowKey: 'id' } });
    const row = bodyRows(w)[0];
    expect(row.attributes('tabindex')).toBeUndefined();
    expect(row.attributes('aria-selected')).toBeUndefined();
    expect(row.classes()).not.toContain('cursor-pointer');
    await row.trigger('click');
    expect(w.emitted('select')).toBeUndefined();
  });

  it('hands a row click on with the row, and only then draws the rows as clickable', async () => {
    const clicked: Item[] = [];
    const w = mount(ItemTable, { props: { rows, columns, rowKey: 'id', onRowClick: (_e, row) => clicked.push(row) } });
    expect(bodyRows(w)[1].classes()).toContain('cursor-pointer');
    await bodyRows(w)[1].trigger('click');
    expect(clicked).toEqual([rows[1]]);
  });

  const selectable = (selected: string | null) =>
    mount(ItemTable, {
      props: {
        rows,
        columns,
        rowKey: 'id',
        selected,
        rowTest: 'item-row',
        rowClass: (r: Item) => ({ heavy: r.mass > 20 }),
      },
    });
  const rowOf = (w: ReturnType<typeof mount>, key: string) => w.find(`tr[data-row-key="${key}"]`);

  it('selects a row by its key on a click, Enter or Space', async () => {
    const w = selectable(null);
    await rowOf(w, 'b').trigger('click');
    await rowOf(w, 'c').trigger('keydown', { key: 'Enter' });
    await rowOf(w, 'a').trigger('keydown', { key: ' ' });
    await rowOf(w, 'a').trigger('keydown', { key: 'x' });
    expect(w.emitted('select')).toEqual([['b'], ['c'], ['a']]);
    expect(rowOf(w, 'a').attributes('tabindex')).toBe('0');
    expect(rowOf(w, 'a').attributes('data-test')).toBe('item-row');
  });

  it('leaves keys pressed in a control inside a row to that control', async () => {
    const w = mount(ItemTable, {
      props: { rows, columns, rowKey: 'id', selected: null },
      slots: { cell: () => h('button', 'Edit') },
    });
    await rowOf(w, 'a').find('button').trigger('keydown', { key: 'Enter' });
    expect(w.emitted('select')).toBeUndefined();
  });

  it('marks the selected row, and only it, and follows `selected` when it changes', async () => {
    const w = selectable('b');
    const marked = () => bodyRows(w).filter((r) => r.attributes('aria-selected') === 'true');
    expect(marked().map((r) => r.attributes('data-row-key'))).toEqual(['b']);
    expect(rowOf(w, 'a').attributes('aria-selected')).toBe('false');
    expect(rowOf(w, 'b').classes()).toContain('data-table__selected');
    await w.setProps({ selected: 'c' });
    expect(marked().map((r) => r.attributes('data-row-key'))).toEqual(['c']);
    expect(rowOf(w, 'b').classes()).not.toContain('data-table__selected');
  });

  it("adds the caller's row classes and draws cells as formatted values unless the cell slot says otherwise", () => {
    const w = selectable(null);
    expect(rowOf(w, 'c').classes()).toContain('heavy');
    expect(rowOf(w, 'a').classes()).not.toContain('heavy');
    expect(
      rowOf(w, 'b')
        .findAll('td')
        .map((c) => c.text()),
    ).toEqual(['Cleat', '3.2']);
    const own = mount(ItemTable, {
      props: { rows, columns, rowKey: 'id', selected: null },
      slots: { cell: (s) => `${s.col.name}=${String(s.value)}` },
    });
    expect(
      rowOf(own, 'b')
        .findAll('td')
        .map((c) => c.text()),
    ).toEqual(['name=Cleat', 'mass=3.2']);
  });
});
