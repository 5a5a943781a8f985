import { AirVent, Box, Cog, Container, Fan, Gauge, SlidersVertical, Snowflake, Thermometer, Timer, ToggleRight, Zap, type LucideIcon } from 'lucide-react';
import type { EquipmentType } from '@/lib/equipment/types';
import { cn } from '@/lib/utils';

// Decorative: the type's word is always shown next to it.
const icons: Record<EquipmentType, LucideIcon> = {
  condensing_unit: Container,
  compressor: Cog,
  evaporator: Snowflake,
  condenser: AirVent,
  pressure_control: Gauge,
  thermostat: Thermometer,
  solenoid_valve: ToggleRight,
  expansion_valve: SlidersVertical,
  defrost_control: Timer,
  contactor: Zap,
  fan_motor: Fan,
  other: Box,
};

export function EquipmentTypeIcon({ type, className }: { type: EquipmentType; className?: string }) {
  const Icon = icons[type] ?? Box;
  return <Icon aria-hidden className={cn('size-5 shrink-0 text-ice-700', className)} />;
}
