// The open building's members and invitations (docs/rights.md): listed when the members dialog opens, added,
// given another role and removed, optimistically where the answer is predictable.
import { ref } from 'vue';
import { defineStore } from 'pinia';
import type { Member, Role } from '@shared/schema/api.ts';
import * as membersApi from '@/api/members.ts';
import { attempt } from './attempt.ts';
import type { LoadState } from './buildings.ts';
import { useNotifyStore } from './notify.ts';

/** The path key of a member: the user id, or the e-mail address while the invitation is pending. */
export const memberKey = (m: Member): string | number => m.userId ?? m.email;

export const useMembersStore = defineStore('members', () => {
  const notify = useNotifyStore();
  const buildingId = ref<number | null>(null);
  const members = ref<Member[]>([]);
  const state = ref<LoadState>('idle');

  /** Forgets the members of another building (on opening a building). */
  function reset(forBuilding: number | null): void {
    if (buildingId.value === forBuilding) return;
    buildingId.value = forBuilding;
    members.value = [];
    state.value = 'idle';
  }

  const building = (): number => {
    if (buildingId.value === null) throw new Error('No building is open');
    return buildingId.value;
  };

  async function load(): Promise<void> {
    state.value = 'loading';
    const ok = await attempt(notify, 'Could not load the members', async () => {
      members.value = await membersApi.listMembers(building());
    });
    state.value = ok ? 'ready' : 'error';
  }

  async function add(email: string, role: Role): Promise<boolean> {
    return attempt(notify, 'Could not add the member', async () => {
      await membersApi.addMember(building(), { email, role });
      members.value = await membersApi.listMembers(building());
    });
  }

  async function changeRole(member: Member, role: Role): Promise<boolean> {
    const before = members.value;
    members.value = members.value.map((m) => (memberKey(m) === memberKey(member) ? { ...m, role } : m));
    return attempt(
      notify,
      'Could not change the role',
      () => membersApi.updateMember(building(), memberKey(member), { role }),
      () => (members.value = before),
    );
  }

  async function remove(member: Member): Promise<boolean> {
    const before = members.value;
    members.value = members.value.filter((m) => memberKey(m) !== memberKey(member));
    return attempt(
      notify,
      'Could not remove the member',
      () => membersApi.removeMember(building(), memberKey(member)),
      () => (members.value = before),
    );
  }

  return { members, state, reset, load, add, changeRole, remove };
});
