using ThermVerify.Check.Noise;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// The reading's noise against ngspice's .noise on the same deck: the acquisition circuit (switch closed into the
/// sampling capacitor) of the bundled unbuffered RC-filtered example, the density at the sampling capacitor and at the
/// pin, within 1 % as the example decks' noise check (EngineCrossCheckTests).
/// </summary>
public class NoiseCrossCheckTests
{
    private static readonly Lazy<NgspiceEngine> Ngspice = new(() => new NgspiceEngine());

    [NgspiceTheory]
    [InlineData("hold")]
    [InlineData("pin")]
    public void Density_of_the_acquisition_circuit_agrees_with_ngspice_within_one_percent(string where)
    {
        var design = ExampleDesigns.Load("dosing-pump-ntc-rc.toml");
        const double celsius = 30;
        var circuit = SamplingNoiseCircuit.Acquiring(design, celsius);
        var node = where == "hold" ? FrontEndNodes.Hold : FrontEndCircuit.PinNode(design);
        // SPICE's .noise refers to an input with an AC value; the output density does not depend on it.
        var input = new Circuit(circuit.Elements.Select(e => e is VoltageSource { Name: "Vexc" } v ? v with { AcMagnitude = 1 } : e), celsius);
        var deck = SpiceDeckWriter.Write(input, new NoiseSweep(node, "Vexc", 1, 1e9, 5), null, [new PrintVectors("noise", ["onoise_spectrum"])]);
        var plot = Ngspice.Value.Run(deck).Plot("noise");
        var frequencies = plot["frequency"].Real;
        var theirs = plot["onoise_spectrum"].Real;
        var ours = NoiseAnalysis.Run(circuit, node, FrequencySweep.At(frequencies)).OutputDensity;
        for (var k = 0; k < frequencies.Length; k++)
            Tolerance.AssertClose(theirs[k], ours[k], 0.01, 0, $"noise density at {where}, {frequencies[k]:G4} Hz");
    }
}
