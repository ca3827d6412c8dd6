package main

import (
	"fmt"
	"io"
	"strconv"
	"strings"
	"text/tabwriter"

	"plumb/density"
	"plumb/sketch"
)

const materialsAbout = `Lists the built-in sheet materials with their densities and sources, then the gauge tables
(gauge numbers mean different thicknesses for different materials: the thickness is always shown).
The steel gauges are defined by weight: carbon and galvanized steel given by gauge weigh the
table's lb/ft²; stainless steel uses the steel gauge's thickness times its own density.
With --gauges=false, the materials only.`

func runMaterials(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("materials", "plumb materials [--gauges=false]", materialsAbout, stderr)
	gauges := fs.Bool("gauges", true, "also list the gauge tables")
	operands, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if len(operands) > 0 {
		return usageError(stderr, "materials", "takes no files")
	}
	mats := density.Materials()
	tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "key\tname\tdensity\tsource")
	for _, m := range mats {
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", m.Key, m.Name, materialDensity(m), m.Source)
	}
	tw.Flush()
	if *gauges {
		writeGauges(stdout, mats)
	}
	fmt.Fprintln(stdout)
	sketch.WriteCautions(stdout)
	return exitOK
}

// materialDensity shows a material's density with its unit, marked ≈ when it varies.
func materialDensity(m density.Material) string {
	s := strconv.FormatFloat(m.Density, 'g', -1, 64)
	if m.Areal {
		s += " kg/m² per mm"
	} else {
		s += " kg/m³"
	}
	if m.Approx {
		s = "≈ " + s
	}
	return s
}

// writeGauges writes each gauge table, headed by its name, its source and the materials that use it:
// by weight (the table's lb/ft²) or by thickness (the thickness times the material's density).
func writeGauges(w io.Writer, mats []density.Material) {
	byWeight, byThickness := map[string][]string{}, map[string][]string{}
	for _, m := range mats {
		switch {
		case m.GaugeSystem == "":
		case m.GaugeWeight:
			byWeight[m.GaugeSystem] = append(byWeight[m.GaugeSystem], m.Name)
		default:
			byThickness[m.GaugeSystem] = append(byThickness[m.GaugeSystem], m.Name)
		}
	}
	for _, t := range density.GaugeTables() {
		fmt.Fprintf(w, "\n%s (%s)\n", t.Name, t.Source)
		if u := byWeight[t.Key]; len(u) > 0 {
			fmt.Fprintf(w, "%s: weight by gauge is the table's lb/ft² (the gauge's basis, 41.82 lb/ft² per inch)\n", strings.Join(u, ", "))
		}
		if u := byThickness[t.Key]; len(u) > 0 {
			fmt.Fprintf(w, "%s: the table's thickness × the material's density\n", strings.Join(u, ", "))
		}
		writeGaugeRows(w, t)
	}
}

// writeGaugeRows writes a gauge table's rows, with the defining weight when the table has one.
func writeGaugeRows(w io.Writer, t density.GaugeTable) {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	if t.ByWeight {
		fmt.Fprintln(tw, "gauge\tmm\tin\tlb/ft²\tkg/m²\t")
	} else {
		fmt.Fprintln(tw, "gauge\tmm\tin\t")
	}
	for _, g := range density.Gauges(t.Key) {
		if t.ByWeight {
			lb := strconv.FormatFloat(g.LbFt2, 'f', -1, 64)
			fmt.Fprintf(tw, "%d\t%.2f\t%.4f\t%s\t%.3f\t\n", g.Number, g.MM, g.In, lb, g.KgM2())
		} else {
			fmt.Fprintf(tw, "%d\t%.2f\t%.4f\t\n", g.Number, g.MM, g.In)
		}
	}
	tw.Flush()
}
