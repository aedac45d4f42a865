import { SettingsScreen } from '@/components/settings/settings-screen';

export default function SettingsRoute() {
  return <SettingsScreen />;
}
