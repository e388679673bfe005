package fuel

// Built-in grades. Sources, figure by figure:
//
//   - LCV (SetLHV), C_F (CF) and the IMO carbon fraction (IMOCarbon): IMO
//     resolution MEPC.364(79), 2022 EEDI calculation guidelines, para 2.1
//     table, as listed in plant-checks.md §1.3 [S] (values from memory of
//     the table; only HFO 3.114 was seen in a secondary page).
//   - Ultimate analyses: plant-checks.md §1.2 and §2.1, typical values [M];
//     methane's is exact from molar masses [C].
//   - Densities, viscosities, water and ash: typical values [M], except
//     HSFO's 380 cSt at 50 °C / 35 cSt at 100 °C, which is the assumption of
//     plant-checks.md §5.1 check B [C].
//
// The array is never mutated; Grade returns copies.
var grades = [...]Fuel{
	{
		Name:  "MGO",
		Class: Distillate,
		ISO: ISO8217{
			Density15:  860,    // typical DMA [M]
			Viscosity:  3.0e-6, // 3.0 cSt at 40 °C, typical DMA (ISO 8217 DMA 2.0–6.0, from memory) [M]
			ViscosityT: 313.15,
			Sulfur:     0.001, // ≤ 0.1 % m/m [M] (plant-checks.md §1.2)
		},
		Viscosity2: ViscosityPoint{T: 373.15, Nu: 1.2e-6}, // 1.2 cSt at 100 °C, typical [M]
		// C 86.6, H 13.2, S 0.1, O 0.1: plant-checks.md §2.1 MGO [M]
		Analysis:     Analysis{C: 0.866, H: 0.132, S: 0.001, O: 0.001},
		SetLHV:       42.7e6, // IMO LCV 42 700 kJ/kg, diesel/gas oil, MEPC.364(79) [S]
		SetLHVSource: "IMO MEPC.364(79) LCV, diesel/gas oil",
		CF:           3.206, // MEPC.364(79) [S]
		CFSource:     "IMO MEPC.364(79), diesel/gas oil",
		IMOCarbon:    0.8744, // MEPC.364(79) [S]
	},
	{
		Name:  "VLSFO",
		Class: Residual,
		ISO: ISO8217{
			Density15:  950,    // typical [M]
			Viscosity:  150e-6, // 150 cSt at 50 °C, typical RMG-grade VLSFO [M]
			ViscosityT: 323.15, //
			Sulfur:     0.005,  // ≤ 0.50 % m/m (the grade's definition)
			Water:      0.0005, // typical [M]
			Ash:        0.0003, // typical [M]
		},
		Viscosity2: ViscosityPoint{T: 373.15, Nu: 20e-6}, // 20 cSt at 100 °C, typical [M]
		// plant-checks.md §2.1 VLSFO (C 87.0, H 11.8, S 0.5, N 0.3, O 0.4) [M],
		// with the typical water and ash above taken from the carbon.
		Analysis: Analysis{C: 0.8692, H: 0.118, S: 0.005, N: 0.003, O: 0.004, Water: 0.0005, Ash: 0.0003},
		// A VLSFO of an RME–RMK grade counts as HFO in the IMO table; one of
		// grade RMA–RMD would count as LFO (41 200 kJ/kg, C_F 3.151).
		SetLHV:       40.2e6, // IMO LCV 40 200 kJ/kg, HFO, MEPC.364(79) [S]
		SetLHVSource: "IMO MEPC.364(79) LCV, HFO (RME-RMK)",
		CF:           3.114, // MEPC.364(79) [S]
		CFSource:     "IMO MEPC.364(79), HFO (RME-RMK)",
		IMOCarbon:    0.8493, // MEPC.364(79) [S]
	},
	{
		Name:  "HSFO",
		Class: Residual,
		ISO: ISO8217{
			Density15:  985,    // plant-checks.md §1.1 row 3 and §3.3 [C]
			Viscosity:  380e-6, // 380 cSt at 50 °C: RMG 380, plant-checks.md §5.1 check B
			ViscosityT: 323.15, //
			Sulfur:     0.025,  // 2.5 % m/m, plant-checks.md §1.2 test fuel [M]
		},
		Viscosity2: ViscosityPoint{T: 373.15, Nu: 35e-6}, // 35 cSt at 100 °C, plant-checks.md §5.1 check B assumption
		// plant-checks.md §1.2 test fuel: C 86.0, H 11.0, S 2.5, N 0.3, O 0.2 [M]
		Analysis:     Analysis{C: 0.860, H: 0.110, S: 0.025, N: 0.003, O: 0.002},
		SetLHV:       40.2e6, // IMO LCV 40 200 kJ/kg, HFO, MEPC.364(79) [S]
		SetLHVSource: "IMO MEPC.364(79) LCV, HFO (RME-RMK)",
		CF:           3.114, // MEPC.364(79) [S]; the one value seen in a secondary page
		CFSource:     "IMO MEPC.364(79), HFO (RME-RMK)",
		IMOCarbon:    0.8493, // MEPC.364(79) [S]
	},
	{
		Name:  "LNG",
		Class: Gas,
		// Taken as pure methane: C = 12.0107/16.04246, H = 4·1.00794/16.04246,
		// exact from molar masses [C] (plant-checks.md §1.2). Liquid LNG is
		// about 430–470 kg/m³ near −162 °C [M]; no liquid property is modelled.
		Analysis:     Analysis{C: AtomicC / (AtomicC + 4*AtomicH), H: 4 * AtomicH / (AtomicC + 4*AtomicH)},
		SetLHV:       48.0e6, // IMO LCV 48 000 kJ/kg, LNG, MEPC.364(79) [S]
		SetLHVSource: "IMO MEPC.364(79) LCV, LNG",
		CF:           2.750, // MEPC.364(79) [S]
		CFSource:     "IMO MEPC.364(79), LNG",
		IMOCarbon:    0.7500, // MEPC.364(79) [S]
	},
}
