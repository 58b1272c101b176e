using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// The density a delta-sigma reading's noise starts from (the DC circuit at the pin, docs/methods.md section 15)
/// against ngspice's .noise on the same deck, for the bundled delta-sigma example, within 1 % as the other noise checks.
/// </summary>
public class DeltaSigmaNoiseCrossCheckTests
{
    [NgspiceFact]
    public void Density_at_the_pin_of_the_delta_sigma_example_agrees_with_ngspice_within_one_percent()
    {
        var design = ExampleDesigns.Load("kiln-bank-pt100-deltasigma.toml");
        const double celsius = 75;
        var circuit = FrontEndCircuit.Dc(design, null, celsius);
        var node = FrontEndCircuit.PinNode(design);
        var source = FrontEndDecks.AcInputSource(design);
        // SPICE's .noise refers to an input with an AC value; the output density does not depend on it.
        var input = new Circuit(circuit.Elements.Select(e => e switch
        {
            VoltageSource v when v.Name == source => v with { AcMagnitude = 1 },
            CurrentSource i when i.Name == source => i with { AcMagnitude = 1 },
            _ => e,
        }), celsius);
        var deck = SpiceDeckWriter.Write(input, new NoiseSweep(node, source, 1, 1e6, 5), null, [new PrintVectors("noise", ["onoise_spectrum"])]);
        using var ngspice = new NgspiceEngine();
        var plot = ngspice.Run(deck).Plot("noise");
        var frequencies = plot["frequency"].Real;
        var theirs = plot["onoise_spectrum"].Real;
        var ours = NoiseAnalysis.Run(circuit, node, FrequencySweep.At(frequencies)).OutputDensity;
        Assert.True(frequencies.Length > 20);
        for (var k = 0; k < frequencies.Length; k++)
            Tolerance.AssertClose(theirs[k], ours[k], 0.01, 0, $"noise density at the pin, {frequencies[k]:G4} Hz");
    }
}
