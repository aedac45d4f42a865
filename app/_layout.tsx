import { z } from 'zod';
import { Slot } from 'expo-router';
import { AppProviders } from '@/components/app-providers';

// zod's JIT probes `new Function`, which the Content Security Policy (no 'unsafe-eval') refuses.
z.config({ jitless: true });

export default function RootLayout() {
  return (
    <AppProviders>
      <Slot />
    </AppProviders>
  );
}
