// What happened on each demo site over the last fifteen months, visit by visit. The threads an
// owner and the office should find in the app:
// - Pell Street Kitchen: the 2004 walk-in freezer unit fails three times in ninety days (a seized
//   condenser fan motor, a pitted contactor, then a hard-starting compressor) and its condition
//   drops; a cooler drain heater is found dead and replaced on the next visit.
// - Commissary: freezer 1's compressor wears out visit by visit (current and head pressure up,
//   condition 4 → 2); a missing disconnect cover on freezer 2 is an open safety finding, and the
//   technician is back on site today about it.
// - Linden Avenue Market: the dairy case line loses charge; the second addition is over the
//   leak-rate threshold, the leak is found at case 2's coil and the repair is still to be made.
// - Quarry Road Market: an overcharged frozen-aisle circuit has refrigerant recovered.
// - Orchard Row Bistro: a bar reach-in's small repairs (its walk-in cooler's leak work comes from
//   demo-leak-work.ts).
import { exifTime, siteDate, siteTime } from '@/docker-free-scripts/demo/history/clock';
import { damageImage, nameplateImage } from '@/docker-free-scripts/demo/history/images';
import { fToC, lb, psig } from '@/docker-free-scripts/demo/history/plant';
import type { Deviation } from '@/docker-free-scripts/demo/history/readings';
import { logVisit, type DemoState, type VisitLog, type VisitPlan } from '@/docker-free-scripts/demo/history/recorder';

const F_DIFF = (f: number) => f / 1.8;

async function visit(state: DemoState, plan: VisitPlan, work: (v: VisitLog) => Promise<void>): Promise<VisitLog> {
  const site = state.sites.get(plan.site)!;
  return logVisit(state, { reviewed: plan.daysAgo > 3, ...plan }, work, siteTime(state.now, site.timeZone, plan.daysAgo, plan.hour, 10 + (plan.daysAgo % 5) * 7));
}

/** The usual maintenance round on one system: readings, coil and electrical work, condition. */
async function routine(v: VisitLog, systemKey: string, opts: { rating: number; evapRating?: number; deviation?: Deviation; work?: string }) {
  await v.reading(systemKey, opts.deviation);
  await v.action(`${systemKey}.cu`, opts.work ?? 'Cleaned the condenser coil, checked fan blades and terminals, checked the sight glass and the drain.');
  await v.condition(`${systemKey}.cu`, opts.rating);
  if (opts.evapRating) await v.condition(v.hasEquipment(`${systemKey}.evap`) ? `${systemKey}.evap` : `${systemKey}.evap1`, opts.evapRating);
}

async function pellStreet(state: DemoState) {
  const site = 'Pell Street Kitchen';
  let drainHeater: string | null = null;
  for (const [i, daysAgo] of [452, 362, 272, 183, 93].entries()) {
    await visit(state, { site, daysAgo, hour: 6, reason: 'maintenance', summary: pellSummaries[i]! }, async (v) => {
      await routine(v, 'pell-cooler', { rating: 4, evapRating: 4 });
      await routine(v, 'pell-freezer', { rating: 3, evapRating: 3, deviation: { loadFraction: 0.84 + 0.02 * i } });
      if (i % 2 === 0) await routine(v, 'pell-reachin', { rating: 5, work: 'Vacuumed the condenser behind the kick plate; door gasket and hinges checked.' });
      if (i === 0) {
        await v.setting('pell-cooler.tstat', { control: 'thermostat', asFound: { setpointC: fToC(41), differentialK: F_DIFF(4) }, asLeft: { setpointC: fToC(36), differentialK: F_DIFF(4) } });
        await v.note('pell-cooler.tstat', 'Kitchen staff had turned the cooler up during a delivery. Set back to 36 °F and showed the manager the setpoint.');
        await v.photo('pell-freezer.cu', 'nameplate', 'Freezer condensing unit nameplate', (t) => nameplateImage('Kelvrin', ['MODEL KCU-330L   SERIAL KV-04-06218', '208-230 V  3 PH  60 HZ   RLA 14.1  LRA 91', 'MCA 19.8 A   MOP 30 A', 'REFRIGERANT R-404A   DESIGN 450 / 250 PSIG', 'MFD 04/2004'], t), exifTime);
      }
      if (i === 1) {
        drainHeater = await v.finding('pell-cooler.evap', 'Drain line heater cold; ice building at the drain outlet behind the evaporator.', 'minor', 'Replace the cooler evaporator drain line heater');
      }
      if (i === 2 && drainHeater) {
        await v.part('pell-cooler.evap', 'Drain line heat tape, 6 ft, 120 V');
        await v.resolve(drainHeater, 'New heat tape on the drain line; drain clear and warm after a defrost.');
      }
      if (i === 3) {
        const boxC = fToC(-10);
        await v.setting('pell-freezer.lp', {
          control: 'low',
          asFound: { cutInKpaG: psig(33), differentialKpa: psig(10) },
          asLeft: { cutInKpaG: psig(21), differentialKpa: psig(8) },
        });
        await v.note('pell-freezer.lp', `Pump-down control was cutting in above box temperature (${boxC.toFixed(1)} °C design); reset so the box can pull down.`);
      }
    });
  }

  // Three no-cooling calls in ninety days on the freezer.
  await visit(state, { site, daysAgo: 74, hour: 14, reason: 'no_cooling', summary: 'Freezer at 18 °F: the condenser fan motor had seized and the unit was tripping on high head pressure. Replaced the fan motor; box pulling down.' }, async (v) => {
    await v.reading('pell-freezer', { boxK: F_DIFF(28), liftK: 14, loadFraction: 1.02 });
    await v.finding('pell-freezer.cfan', 'Condenser fan motor seized; blade will not turn by hand. Unit cycling on the high-pressure control.', 'down');
    await v.part('pell-freezer.cfan', 'Condenser fan motor, 1/4 hp, 208-230 V, 1075 rpm', { oldSerial: 'PSK-F-025', newSerial: 'HM-26-40117', replacesEquipment: true });
    await v.reading('pell-freezer', { boxK: F_DIFF(20) });
  });
  await visit(state, { site, daysAgo: 38, hour: 21, reason: 'no_cooling', summary: 'Freezer warm again: compressor off on its internal overload behind a contactor with burnt, pitted contacts. Replaced the contactor; amps normal after restart.' }, async (v) => {
    await v.reading('pell-freezer', { boxK: F_DIFF(24), loadFraction: 1.12 });
    await v.finding('pell-freezer.cont', 'Contactor contacts pitted and burnt on L2; compressor single-phasing and tripping on overload.', 'down');
    await v.part('pell-freezer.cont', 'Contactor, 3 pole, 30 A, 24 V coil', { oldSerial: 'PSK-F-024', newSerial: 'HC-26-11820', replacesEquipment: true });
    await v.reading('pell-freezer', { boxK: F_DIFF(16), loadFraction: 0.92 });
  });
  const third = await visit(state, { site, daysAgo: 9, hour: 7, reason: 'no_cooling', summary: 'Freezer at 20 °F: compressor hard-starting and drawing high current. Fitted a hard-start kit to keep it running; the 2004 unit needs replacing.' }, async (v) => {
    await v.reading('pell-freezer', { boxK: F_DIFF(30), loadFraction: 1.16 });
    await v.finding('pell-freezer.cu', 'Compressor locks on start and draws well over RLA once running; windings test good, valves worn. The unit is 22 years old.', 'degraded', 'Replace the walk-in freezer condensing unit');
    await v.part('pell-freezer.cu', 'Hard-start kit (start capacitor and relay)');
    await v.photo('pell-freezer.cu', 'damage', 'Discoloured compressor terminal cover', (t) => damageImage('Freezer condensing unit, compressor terminals', 'Heat marks on the terminal cover; hard start', t), exifTime);
    await v.condition('pell-freezer.cu', 2, 'Worn compressor; running on a hard-start kit until replaced.');
    await v.reading('pell-freezer', { boxK: F_DIFF(12), loadFraction: 1.06 });
  });
  return { freezerCallVisitId: third.id, freezerCallAt: third.startedAt };
}

const pellSummaries = [
  'Quarterly maintenance. Cooler thermostat set back to 36 °F; all three systems cleaned and checked.',
  'Quarterly maintenance. Cooler drain heater found dead (follow-up raised); otherwise normal.',
  'Quarterly maintenance. Replaced the cooler drain heat tape; reach-in condenser cleaned.',
  'Quarterly maintenance. Freezer pump-down control reset; freezer compressor drawing a little more than last year.',
  'Quarterly maintenance. All systems holding temperature; freezer unit is ageing.',
];

async function orchardRow(state: DemoState) {
  const site = 'Orchard Row Bistro';
  let gasket: string | null = null;
  for (const [i, daysAgo] of [405, 225, 45].entries()) {
    await visit(state, { site, daysAgo, hour: 9, reason: 'maintenance', summary: ['Bar reach-in cleaned and checked; torn door gasket noted.', 'Replaced the bar reach-in door gasket; condenser cleaned.', 'Bar reach-in cleaned and checked; cracked side panel noted and declined by the owner.'][i]! }, async (v) => {
      await routine(v, 'orchard-barback', { rating: 3, evapRating: 3, work: 'Vacuumed the condenser, cleaned the fan blade, checked the door switch.' });
      if (i === 0) gasket = await v.finding('orchard-barback.evap', 'Door gasket torn at the lower hinge corner; frost on the coil from warm air getting in.', 'minor', 'Replace the bar reach-in door gasket');
      if (i === 1 && gasket) {
        await v.part('orchard-barback.evap', 'Door gasket, 24 × 58 in, magnetic');
        await v.resolve(gasket, 'Fitted a new door gasket; door seals all round.');
      }
      if (i === 2) {
        const panel = await v.finding('orchard-barback.cu', 'Cabinet side panel cracked near the condenser grille; no effect on cooling.', 'minor', 'Replace the cracked reach-in side panel');
        if (panel) await declineLater(state, panel, 'The owner plans to replace the bar reach-in next year and declined the panel.', v.lastEntryAt);
      }
    });
  }
}

async function declineLater(state: DemoState, followUpId: string, resolution: string, at: Date) {
  const { updateFollowUp } = await import('@/lib/follow-ups/service');
  await updateFollowUp(state.office, followUpId, { status: 'declined', resolution, visitId: null }, state.db);
  const closed = new Date(at.getTime() + 26 * 3_600_000);
  await state.db.updateTable('follow_ups').set({ closed_at: closed, updated_at: closed }).where('id', '=', followUpId).execute();
}

async function commissary(state: DemoState, claimBlankTag: (v: VisitLog) => Promise<void>) {
  const site = 'Commissary';
  const f1 = [
    { rating: 4, deviation: { loadFraction: 0.82 } },
    { rating: 4, deviation: { loadFraction: 0.86, liftK: 1 } },
    { rating: 3, deviation: { loadFraction: 0.93, liftK: 3 } },
    { rating: 3, deviation: { loadFraction: 0.98, liftK: 4, superheatK: 8 } },
    { rating: 2, deviation: { loadFraction: 1.05, liftK: 6, superheatK: 9 } },
  ];
  let guard: string | null = null;
  for (const [i, daysAgo] of [440, 348, 258, 166, 76].entries()) {
    await visit(state, { site, daysAgo, hour: 5, reason: 'maintenance', summary: commissarySummaries[i]! }, async (v) => {
      if (i === 0) await claimBlankTag(v);
      await routine(v, 'com-f1', { ...f1[i]!, evapRating: 4 });
      await routine(v, 'com-f2', { rating: 3, evapRating: 3 });
      await routine(v, 'com-prep', { rating: 5, evapRating: 5 });
      if (i === 0) guard = await v.finding('com-prep.evap', 'Evaporator fan guard loose; one screw missing.', 'minor', 'Secure the prep cooler evaporator fan guard');
      if (i === 1 && guard) {
        await v.action('com-prep.evap', 'Fitted new screws to the fan guard.');
        await v.resolve(guard, 'Fan guard secured with new stainless screws.');
      }
      if (i === 2) await v.finding('com-f1.cu', 'Discharge line hotter than last visit and the compressor draws more current; condenser is clean, so the valves are wearing.', 'minor');
      if (i === 4) {
        await v.finding('com-f1.cu', 'Compressor now above RLA at full load with high discharge temperature; worn valves. Plan a replacement before summer.', 'degraded', 'Replace the freezer 1 compressor (worn valves)');
        await v.finding('com-f2.cu', 'Service disconnect cover missing; live terminals exposed at hand height in the mechanical room. Taped off and tagged; the cover is not on site.', 'safety', 'Fit a cover to the freezer 2 service disconnect');
        await v.photo('com-f2.cu', 'wiring', 'Freezer 2 disconnect without its cover', (t) => damageImage('Freezer 2 service disconnect', 'Cover missing: terminals exposed, taped and tagged', t, '#374151'), exifTime);
      }
    });
  }
  // Back today about the disconnect cover: work in progress, so owners do not see it yet.
  await visit(state, { site, daysAgo: 0, hour: 8, reason: 'follow_up', summary: null }, async (v) => {
    await v.reading('com-f2');
    await v.note('com-f2.cu', 'Cover kit on order from the supplier; disconnect still taped and tagged. Freezer 2 running normally.');
  });
}

const commissarySummaries = [
  'Quarterly maintenance on all three systems; tagged the prep cooler evaporator.',
  'Quarterly maintenance. Prep cooler fan guard secured.',
  'Quarterly maintenance. Freezer 1 compressor drawing more current than before; watching it.',
  'Quarterly maintenance. Freezer 1 compressor still climbing; other systems normal.',
  'Quarterly maintenance. Freezer 1 compressor due for replacement; freezer 2 disconnect cover missing (safety follow-up).',
];

async function lindenAvenue(state: DemoState) {
  const site = 'Linden Avenue Market';
  for (const [i, daysAgo] of [438, 378, 318, 262, 200, 140, 82, 22].entries()) {
    const last = i === 7;
    await visit(state, { site, daysAgo, hour: 5, reason: 'maintenance', summary: lindenSummaries[i]! }, async (v) => {
      const lowCharge = i === 3 || last;
      await routine(v, 'linden-dairy', {
        rating: 4,
        evapRating: 4,
        deviation: lowCharge ? { subcoolK: 1.5, superheatK: 13, boxK: F_DIFF(5) } : {},
        work: 'Cleaned case return air grilles and honeycombs, condenser coil on the roof, checked the sight glass.',
      });
      if (i === 0) await v.photo('linden-dairy.cu', 'nameplate', 'Dairy line condensing unit nameplate', (t) => nameplateImage('Kelvrin', ['MODEL KCU-610M   SERIAL KV-16-50391', '230 V  3 PH  60 HZ   RLA 18.6  LRA 118', 'MCA 25.6 A   MOP 40 A', 'REFRIGERANT R-448A   FACTORY 12 LB', 'DESIGN 450 / 250 PSIG   MFD 05/2016'], t), exifTime);
      if (i === 3) {
        await v.finding('linden-dairy.cu', 'Bubbles in the sight glass and low subcooling: the circuit is short of charge.', 'minor');
        await v.refrigerant('linden-dairy.cu', 'added', lb(4), 'CYL-2291');
        await v.leak('linden-dairy.cu', { activity: 'inspection', method: 'electronic_detector', result: 'no_leak_found', note: 'Checked the roof unit, line set and all three cases; no leak found. Added dye to the circuit.' });
      }
      if (last) {
        await v.refrigerant('linden-dairy.cu', 'added', lb(6), 'CYL-2318');
        await v.leak('linden-dairy.evap2', { activity: 'inspection', method: 'fluorescent_dye', result: 'leak_found', location: 'Dairy case 2 coil, return bend at the left end', note: 'Dye glowing at the return bend under the UV lamp; oil film on the drain pan.' });
        const system = state.systems.get('linden-dairy')!;
        const addition = await state.db
          .selectFrom('entries')
          .select('computed')
          .where('system_id', '=', system.id)
          .where('kind', '=', 'refrigerant')
          .orderBy('recorded_at', 'desc')
          .executeTakeFirstOrThrow();
        const due = (addition.computed as { leak?: { repairDueDate?: string | null } } | null)?.leak?.repairDueDate;
        await v.finding('linden-dairy.evap2', `Refrigerant leak at the case 2 coil return bend. The addition today is over the leak-rate threshold${due ? `; repair due by ${due}` : ''}.`, 'degraded', 'Repair the refrigerant leak at dairy case 2');
        await v.condition('linden-dairy.evap2', 3, 'Corrosion on the coil return bends by the entrance doors.');
        await v.photo('linden-dairy.evap2', 'corrosion', 'Dye trace at the case 2 coil return bend', (t) => damageImage('Dairy case 2 coil, left return bend', 'UV dye trace: leak at the bend', t, '#1e3a5f'), exifTime);
      }
      if (i % 2 === 0 || last) {
        await routine(v, 'linden-meat', { rating: 4, evapRating: 4 });
        await routine(v, 'linden-frozen', { rating: 3, evapRating: 3, deviation: { loadFraction: 0.88 } });
      }
      if (i === 2) {
        await v.setting('linden-meat.hp', { control: 'high', asFound: { cutOutKpaG: psig(330), differentialKpa: psig(100) }, asLeft: { cutOutKpaG: psig(400), differentialKpa: psig(100) } });
        await v.note('linden-meat.hp', 'Store reported the meat cooler stopping on hot afternoons: the high-pressure control had been set far below the unit’s rating.');
      }
      if (i === 4) await v.finding('linden-frozen.evap', 'Drain pan rusting through at the outlet; small drip onto the floor below.', 'minor', 'Replace the frozen storage evaporator drain pan');
    });
  }
}

const lindenSummaries = [
  'Maintenance on all three systems; photographed the dairy unit nameplate.',
  'Dairy case line maintenance; cases and condenser cleaned.',
  'Maintenance on all three systems. Meat cooler high-pressure control reset to the unit’s rating.',
  'Dairy line short of charge: added 4 lb of R-448A; leak search found nothing, dye added.',
  'Maintenance on all three systems. Frozen storage drain pan rusting (follow-up raised).',
  'Dairy case line maintenance; holding temperature.',
  'Maintenance on all three systems; all holding temperature.',
  'Dairy line short of charge again: added 6 lb of R-448A, over the leak-rate threshold. Dye shows the leak at the case 2 coil; repair to be booked.',
];

async function quarryRoad(state: DemoState) {
  const site = 'Quarry Road Market';
  for (const [i, daysAgo] of [425, 305, 185, 65].entries()) {
    await visit(state, { site, daysAgo, hour: 6, reason: 'maintenance', summary: quarrySummaries[i]! }, async (v) => {
      await routine(v, 'quarry-produce', { rating: 5, evapRating: 5 });
      const overcharged = i === 1;
      await routine(v, 'quarry-frozen', { rating: 4, evapRating: 4, deviation: overcharged ? { subcoolK: 16, liftK: 5, loadFraction: 0.95 } : {} });
      if (overcharged) {
        await v.finding('quarry-frozen.cu', 'Circuit overcharged after last season’s work elsewhere: subcooling about 29 °F and head pressure high.', 'minor');
        await v.refrigerant('quarry-frozen.cu', 'recovered', lb(1.5), 'REC-14');
        await v.reading('quarry-frozen');
      }
      if (i === 3) {
        const fins = await v.finding('quarry-produce.cu', 'Condenser coil fins flattened along the bottom edge where carts hit the unit.', 'minor', 'Comb the produce cooler condenser fins and fit a cart guard');
        if (fins) {
          const { updateFollowUp } = await import('@/lib/follow-ups/service');
          const siteInfo = state.sites.get(site)!;
          await updateFollowUp(state.office, fins, { status: 'scheduled', scheduledFor: siteDate(new Date(state.now.getTime() + 12 * 86_400_000), siteInfo.timeZone) }, state.db);
        }
        await v.photo('quarry-produce.cu', 'damage', 'Flattened condenser fins', (t) => damageImage('Produce cooler condensing unit', 'Fins flattened along the bottom edge', t, '#52525b'), exifTime);
      }
    });
  }
}

const quarrySummaries = [
  'Maintenance on both systems; all normal.',
  'Frozen aisle circuit overcharged: recovered 1.5 lb of R-407A; head pressure and subcooling back to normal.',
  'Maintenance on both systems; all normal.',
  'Maintenance on both systems. Produce cooler condenser fins damaged by carts; fin combing and a guard scheduled.',
];

export async function writeStory(state: DemoState, claimBlankTag: (v: VisitLog) => Promise<void>) {
  const pell = await pellStreet(state);
  await orchardRow(state);
  await commissary(state, claimBlankTag);
  await lindenAvenue(state);
  await quarryRoad(state);
  return pell;
}
