import { NewTankScreen } from '@/components/tanks/new-tank-screen';

export default function NewTankRoute() {
  return <NewTankScreen />;
}
