import type { VendorInput } from '@amberline/common';
import type { Db } from '../db';

let counter = 0;
const unique = () => `${Date.now().toString(36)}${process.pid.toString(36)}${(counter++).toString(36)}`;

/** An invented escort company in Texas and Oklahoma, with one certified operator and a fully equipped pole car. */
export const vendorDefaults = (): VendorInput => {
  const u = unique();
  return {
    company: `Mesquite Flag Escorts ${u}`,
    contactName: 'Rosalind Quade',
    email: `escorts.${u}@vendor.test.amberline.example`,
    phone: '+1 512 555 0142',
    states: ['TX', 'OK'],
    operators: [
      { name: 'Rosalind Quade', phone: '+1 512 555 0142', certifications: [{ state: 'OK', number: `OK-PE-${u.slice(-6).toUpperCase()}`, expires: '2099-12-31' }] },
      { name: 'Tobin Hallet', certifications: [] },
    ],
    insurance: { carrier: 'Bluestem Mutual', policyNumber: `BM-${u.slice(-6)}`, liabilityLimitUsd: 1_000_000, autoLimitUsd: 1_000_000, expires: '2099-12-31' },
    vehicles: [
      { label: 'White pickup with pole', plate: 'PLT-0001', equipment: { heightPole: true, amberLights: true, signs: true, flags: true } },
      { label: 'Silver pickup', equipment: { heightPole: false, amberLights: true, signs: true, flags: true } },
    ],
    rates: { basis: 'per_mile', perMileUsd: 1.95, minimumUsd: 450, noGoUsd: 300, layoverUsd: 350 },
    notes: 'Invented vendor for tests and demos.',
    active: true,
  };
};

/** Inserts one escort vendor. Defaults are unique per call (company and e-mail), so tests can run side by side. */
export async function seedVendor(db: Db, input: Partial<VendorInput> = {}): Promise<{ id: string; company: string; email: string }> {
  const v = { ...vendorDefaults(), ...input };
  const [row] = await db.query(
    `INSERT INTO vendors (company, contact_name, email, phone, states, operators, insurance, vehicles, rates, notes, active)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11) RETURNING id`,
    [v.company, v.contactName, v.email.toLowerCase(), v.phone, v.states, JSON.stringify(v.operators), JSON.stringify(v.insurance), JSON.stringify(v.vehicles), JSON.stringify(v.rates), v.notes ?? null, v.active ?? true],
  );
  return { id: row.id, company: v.company, email: v.email.toLowerCase() };
}
