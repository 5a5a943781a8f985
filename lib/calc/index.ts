// The refrigeration calculations: pure functions, no I/O. See lib/calc/README.md.
export * from '@/lib/calc/atmosphere';
export * from '@/lib/calc/compliance-rules';
export * from '@/lib/calc/dates';
export * from '@/lib/calc/diagnosis';
export * from '@/lib/calc/electrical';
export * from '@/lib/calc/errors';
export * from '@/lib/calc/format';
export * from '@/lib/calc/leak-rate';
export * from '@/lib/calc/pressure-controls';
export * from '@/lib/calc/reading-bands';
export * from '@/lib/calc/readings';
export * from '@/lib/calc/refrigerants';
export * from '@/lib/calc/saturation';
export * from '@/lib/calc/service-life';
export * from '@/lib/calc/units';
