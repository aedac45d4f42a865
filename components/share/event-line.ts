import type { ScenarioEvent } from '@/simulation/scenario';
import { findSpecies } from '@/simulation/catalogue';

const fishName = (f: { species?: string; name?: string }) => f.name ?? (f.species ? (findSpecies(f.species)?.commonName ?? f.species) : 'fish');

/** One plain line per plan event, for read-only views (pure). */
export function eventLine(e: ScenarioEvent): string {
  const day = `Day ${e.day}`;
  switch (e.type) {
    case 'add-fish':
      return `${day}: add ${e.fish.count} ${fishName(e.fish)}`;
    case 'remove-fish':
      return `${day}: rehome ${e.count} ${fishName(e)}`;
    case 'move-fish':
      return `${day}: move ${e.fish.count} ${fishName(e.fish)} ${e.direction === 'in' ? 'in from' : 'out to'} ${e.otherTank ?? 'another tank'}`;
    case 'feeding':
      return `${day}: change feeding`;
    case 'water-change':
      return `${day}: change ${e.percent} % of the water`;
    case 'ammonia-dose':
      return `${day}: dose ammonia${e.repeatEveryDays ? `, every ${e.repeatEveryDays} days${e.repeatCount ? ` (${e.repeatCount} times)` : ''}` : ''}`;
    case 'filter-clean':
      return `${day}: ${e.action} the ${e.zoneId} media`;
    case 'medication':
      return `${day}: medicate for ${e.durationDays} days${e.name ? ` (${e.name})` : ''}`;
    case 'temperature':
      return `${day}: set the temperature to ${e.temperatureC} °C`;
    case 'aeration-loss':
      return `${day}: aeration lost for ${e.durationDays} days`;
  }
}
