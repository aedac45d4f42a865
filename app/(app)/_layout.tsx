import { Slot } from 'expo-router';
import { SignedInGate } from '@/components/nav/signed-in-gate';
import { AppShell } from '@/components/nav/app-shell';

export default function SignedInLayout() {
  return (
    <SignedInGate>
      <AppShell>
        <Slot />
      </AppShell>
    </SignedInGate>
  );
}
