// Shows stored values the way the signed-in user reads them: dates and times in the farm's
// (or the user's chosen) time zone, areas in acres or hectares, temperatures in °F or °C,
// money from integer cents.
import { computed } from 'vue';
import { DateTime } from 'luxon';
import { useSessionStore } from '@/stores/session';
import { acresToHectares, fahrenheitToCelsius } from '@shared/domain/units';

export function useDisplay() {
  const session = useSessionStore();
  const zone = computed(() => session.timeZone);
  const metric = computed(() => session.units === 'metric');

  const inZone = (iso: string, timeZone?: string) => DateTime.fromISO(iso, { zone: timeZone ?? zone.value });

  return {
    zone,
    metric,
    /** 12 Mar 2027 */
    date: (iso: string, timeZone?: string) => (/^\d{4}-\d{2}-\d{2}$/.test(iso) ? DateTime.fromISO(iso) : inZone(iso, timeZone)).toFormat('d LLL yyyy'),
    /** Fri 12 Mar, 06:30 */
    dateTime: (iso: string, timeZone?: string) => inZone(iso, timeZone).toFormat('ccc d LLL, HH:mm'),
    /** "in 3 days", "2 hours ago" */
    relative: (iso: string) => inZone(iso).toRelative() ?? '',
    area: (acres: number) => (metric.value ? `${acresToHectares(acres).toFixed(1)} ha` : `${acres.toFixed(1)} ac`),
    temperature: (fahrenheit: number) => (metric.value ? `${fahrenheitToCelsius(fahrenheit).toFixed(0)} °C` : `${fahrenheit.toFixed(0)} °F`),
    money: (cents: number, currency = 'USD') => new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(cents / 100),
    count: (n: number) => new Intl.NumberFormat('en-US').format(n),
  };
}
