// The invented demo scenario: two service companies, their people, customers, sites and units.
// Every name, address, model and serial here is made up for the demo.
import type { Stage as StageName, UnitKind } from '#shared/types/diagnosis'
import type { EquipmentClass } from '#shared/types/equipment'
import type { Role } from '#shared/utils/permissions'

export const DEMO_PASSWORD = 'rimecase-demo'

export interface DemoStage {
  stage: StageName
  refrigerant: string
  chargeG: number | null
  volumeL: number | null
  ratedCurrentA: number | null
}
export interface DemoUnit {
  name: string
  kind: UnitKind
  equipmentClass: EquipmentClass
  model: string
  serial: string
  location: string
  designCabinetC: number
  designCascadeHxC: number | null
  stages: DemoStage[]
}
export interface DemoSite {
  name: string
  address: string
  altitudeM: number
  contacts: { name: string; email: string; phone: string }[]
  units: DemoUnit[]
}
export interface DemoOrganisation {
  slug: string
  name: string
  users: { email: string; name: string; role: Role }[]
  customers: { name: string; notes: string; sites: DemoSite[] }[]
}

const cascade = (
  name: string, equipmentClass: EquipmentClass, model: string, serial: string, location: string,
  designCabinetC: number, designCascadeHxC: number, high: [string, number, number], low: [string, number, number, number],
): DemoUnit => ({
  name, kind: 'cascade', equipmentClass, model, serial, location, designCabinetC, designCascadeHxC,
  stages: [
    { stage: 'high', refrigerant: high[0], chargeG: high[1], volumeL: null, ratedCurrentA: high[2] },
    { stage: 'low', refrigerant: low[0], chargeG: low[1], volumeL: low[2], ratedCurrentA: low[3] },
  ],
})

const single = (
  name: string, equipmentClass: EquipmentClass, model: string, serial: string, location: string,
  designCabinetC: number, refrigerant: string, chargeG: number, ratedCurrentA: number,
): DemoUnit => ({
  name, kind: 'single-stage', equipmentClass, model, serial, location, designCabinetC, designCascadeHxC: null,
  stages: [{ stage: 'single', refrigerant, chargeG, volumeL: null, ratedCurrentA }],
})

export const DEMO_ORGANISATIONS: DemoOrganisation[] = [
  {
    slug: 'rimecase-demo',
    name: 'Rimecase Demo Field Service',
    users: [
      { email: 'tech@rimecase.demo', name: 'Mara Quill', role: 'technician' },
      { email: 'engineer@rimecase.demo', name: 'Dev Halloran', role: 'engineer' },
      { email: 'trainer@rimecase.demo', name: 'Ruth Oyelami', role: 'trainer' },
      { email: 'admin@rimecase.demo', name: 'Sam Whitcombe', role: 'admin' },
    ],
    customers: [
      {
        name: 'Lindqvarn Biobank',
        notes: 'Sample stores on 24/7 alarm callout. Sign in at the gatehouse.',
        sites: [
          {
            name: 'Lindqvarn Biobank, Cold Store Wing',
            address: '12 Heronsgate Row, Aldmere AL4 9ZQ',
            altitudeM: 45,
            contacts: [{ name: 'Petra Voss', email: 'petra.voss@lindqvarn.example', phone: '+00 555 0101' }],
            units: [
              cascade('Freezer F-204', 'ult-freezer', 'Polarstack 780', 'PS780-22-0417', 'Cold Store Wing, Bay 2', -80, -32,
                ['R404A', 520, 6.2], ['R170', 210, 9.5, 4.1]),
              cascade('Freezer F-205', 'ult-freezer', 'Polarstack 780H', 'PS780H-23-1102', 'Cold Store Wing, Bay 2', -86, -35,
                ['R290', 148, 5.4], ['R170', 92, 6.8, 3.6]),
              cascade('Freezer F-311', 'ult-freezer', 'Deepvault 5', 'DV5-19-3381', 'Cold Store Wing, Bay 3', -80, -30,
                ['R507A', 600, 6.8], ['R508B', 300, 11.0, 4.4]),
              single('Cold room CR-1', 'cold-room', 'Walkbox 40', 'WB40-17-0093', 'Loading dock', 2, 'R404A', 6500, 11.5),
            ],
          },
        ],
      },
      {
        name: 'Orrin Vale Research Campus',
        notes: 'Lab freezers are logged; ask the lab manager before moving samples.',
        sites: [
          {
            name: 'Orrin Vale, Chemistry Block',
            address: '3 Quarry Fields, Orrin Vale OV2 7XT',
            altitudeM: 1450,
            contacts: [
              { name: 'Jonah Pell', email: 'jonah.pell@orrinvale.example', phone: '+00 555 0202' },
              { name: 'Lab office', email: 'chem-office@orrinvale.example', phone: '+00 555 0203' },
            ],
            units: [
              cascade('Cold trap CT-2', 'cold-trap', 'Rimfrost Trap 100', 'RT100-21-0552', 'Freeze-dryer room 1.14', -100, -38,
                ['R404A', 400, 5.1], ['R1150', 120, 5.5, 3.2]),
              cascade('Freezer F-1', 'ult-freezer', 'Deepvault 3', 'DV3-20-1217', 'Corridor C, by lab 1.20', -80, -30,
                ['R134a', 700, 6.0], ['R23', 250, 10.0, 4.0]),
              single('Freezer -25 FZ-7', 'freezer', 'Chestline 400', 'CL400-24-7781', 'Lab 1.22', -25, 'R290', 145, 2.3),
            ],
          },
        ],
      },
      {
        name: 'Tessaly Materials Test House',
        notes: 'Chambers run long test programmes; agree a stop time with the test engineer.',
        sites: [
          {
            name: 'Tessaly, Climatic Lab',
            address: 'Building 7, Millrace Park, Tessaly TS1 4QP',
            altitudeM: 120,
            contacts: [{ name: 'Ada Kiriakou', email: 'ada.kiriakou@tessaly.example', phone: '+00 555 0303' }],
            units: [
              cascade('Chamber TC-70', 'test-chamber', 'Climacell 1000', 'CC1000-18-0245', 'Climatic Lab, cell 2', -70, -28,
                ['R404A', 1800, 14.5], ['R23', 900, 24.0, 7.8]),
              cascade('Cryo trap CT-120', 'cold-trap', 'Rimfrost Trap 120', 'RT120-22-0031', 'Climatic Lab, vacuum rig', -120, -45,
                ['R507A', 500, 5.6], ['R14', 180, 7.0, 3.4]),
              single('Process chiller PC-3', 'process-chiller', 'Loopchill 12', 'LC12-16-0410', 'Plant room', 10, 'R134a', 4200, 9.8),
            ],
          },
        ],
      },
    ],
  },
  {
    slug: 'bluefen-demo',
    name: 'Bluefen Cooling (demo)',
    users: [{ email: 'tech@bluefen.demo', name: 'Kit Arbel', role: 'technician' }],
    customers: [
      {
        name: 'Marrowby Clinic',
        notes: '',
        sites: [
          {
            name: 'Marrowby Clinic, Pharmacy',
            address: '8 Sallow Street, Marrowby MB3 2LL',
            altitudeM: 30,
            contacts: [{ name: 'Nell Farrant', email: 'nell.farrant@marrowby.example', phone: '+00 555 0404' }],
            units: [single('Vaccine fridge VF-1', 'freezer', 'Medline 300', 'ML300-23-0019', 'Pharmacy store', 5, 'R134a', 180, 1.4)],
          },
        ],
      },
    ],
  },
]
