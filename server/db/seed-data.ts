/**
 * The demo scenario: an invented laboratory, its people and its catalog. Every name here is made up;
 * the password is for the demo only. A second invented laboratory exists to prove isolation.
 */
export const DEMO_PASSWORD = 'parallax-demo';

export const DEMO_LABS = [
  {
    name: 'Vale Harbor Regional Laboratory',
    timeZone: 'America/Halifax',
    users: [
      { name: 'Tomas Reyes', email: 'tech@valeharbor.example', roles: ['technologist'] },
      { name: 'Dr. Imani Okafor', email: 'director@valeharbor.example', roles: ['director'] },
      { name: 'Helga Lindqvist', email: 'quality@valeharbor.example', roles: ['quality'] },
      { name: 'Sam Whitcombe', email: 'admin@valeharbor.example', roles: ['admin'] },
      { name: 'Priya Nair', email: 'lead@valeharbor.example', roles: ['technologist', 'director'] },
    ],
    analytes: [
      { name: 'Glucose', unit: 'mmol/L', decimals: 1, decisionLevels: [2.8, 7.0, 11.1], allowableBiasAbsolute: 0.2, allowableBiasPercent: 4,
        allowableBiasSource: 'Laboratory goal set by the director (2026): the larger of 0.2 mmol/L or 4 % at each decision level' },
      { name: 'Creatinine', unit: 'µmol/L', decimals: 0, decisionLevels: [90, 350], allowableBiasAbsolute: null, allowableBiasPercent: 5,
        allowableBiasSource: 'Laboratory goal set by the director (2026): 5 % bias at each decision level' },
      { name: 'Potassium', unit: 'mmol/L', decimals: 1, decisionLevels: [3.0, 6.0], allowableBiasAbsolute: 0.15, allowableBiasPercent: null,
        allowableBiasSource: 'Laboratory goal set by the director (2026): 0.15 mmol/L at each decision level' },
      { name: 'Thyrotropin (TSH)', unit: 'mIU/L', decimals: 2, decisionLevels: [0.4, 4.0, 10.0], allowableBiasAbsolute: null, allowableBiasPercent: 8,
        allowableBiasSource: 'Laboratory goal set by the director (2026): 8 % bias at each decision level' },
      { name: 'Haemoglobin', unit: 'g/L', decimals: 0, decisionLevels: [70, 100, 180], allowableBiasAbsolute: null, allowableBiasPercent: 3,
        allowableBiasSource: 'Laboratory goal set by the director (2026): 3 % bias at each decision level' },
      { name: 'Sodium', unit: 'mmol/L', decimals: 0, decisionLevels: [130, 150], allowableBiasAbsolute: 2, allowableBiasPercent: null,
        allowableBiasSource: 'Laboratory goal set by the director (2026): 2 mmol/L at each decision level' },
    ],
    instruments: [
      { name: 'Chemistry line 1', model: 'Photometric chemistry analyzer (current)', serial: 'VH-CH-0017', location: 'Core laboratory, bench 2' },
      { name: 'Chemistry line 2', model: 'Photometric chemistry analyzer (new)', serial: 'VH-CH-0342', location: 'Core laboratory, bench 3' },
      { name: 'Immunoassay 1', model: 'Chemiluminescence immunoassay analyzer', serial: 'VH-IA-0105', location: 'Core laboratory, bench 5' },
      { name: 'Point-of-care meter 7', model: 'Handheld glucose meter', serial: 'VH-POC-7781', location: 'Emergency department' },
    ],
  },
  {
    name: 'Cedar Point Clinical Laboratory',
    timeZone: 'Europe/Lisbon',
    users: [
      { name: 'Rui Matos', email: 'tech@cedarpoint.example', roles: ['technologist'] },
      { name: 'Dr. Ana Ferreira', email: 'director@cedarpoint.example', roles: ['director'] },
      { name: 'Leonor Brito', email: 'admin@cedarpoint.example', roles: ['admin'] },
    ],
    analytes: [
      { name: 'Glucose', unit: 'mg/dL', decimals: 0, decisionLevels: [50, 126, 200], allowableBiasAbsolute: 4, allowableBiasPercent: 4,
        allowableBiasSource: 'Laboratory goal set by the director (2026)' },
    ],
    instruments: [
      { name: 'Analyzer A', model: 'Chemistry analyzer', serial: 'CP-0001', location: 'Main laboratory' },
      { name: 'Analyzer B', model: 'Chemistry analyzer', serial: 'CP-0002', location: 'Main laboratory' },
    ],
  },
] as const;
