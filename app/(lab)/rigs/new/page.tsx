import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';
import { RigForm } from '../RigForm';

export default async function NewRigPage() {
  await requireMember('rigs.manage');
  return (
    <>
      <PageHeader title="Register a rig" lead="The output clock, and the light path or electrode the safety sheet will read." />
      <RigForm />
    </>
  );
}
