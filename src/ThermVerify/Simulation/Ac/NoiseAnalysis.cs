using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// Output noise by the adjoint method (Rohrer, Nagel, Meyer & Weber 1971; Vlach & Singhal, from memory):
/// one solve of Aᵀ·y = e_out per frequency gives the transfer y_p − y_q from every noise current
/// injected between unknowns p and q to the output, so each generator's output density is
/// |y_p − y_q|²·S_i(f). Generators: every resistor, sensor and switch (Johnson–Nyquist 4kT/R at the
/// circuit temperature, k exact), diode shot noise 2q|I|, op-amp input voltage and current noise
/// (white with a 1/f corner). Generators are uncorrelated. The op-amp model's own internal resistors
/// are noiseless.
/// </summary>
internal static class NoiseAnalysis
{
    public const string AnalysisName = "Noise";

    /// <param name="start">Where the operating point's Newton starts (see <see cref="SmallSignalSystem"/>).</param>
    /// <param name="elementCelsius">Resistances whose thermal noise is at a temperature of their own (by element name); the rest at the circuit's.</param>
    public static NoiseResult Run(Circuit circuit, string outputNode, FrequencySweep sweep, string referenceNode = Circuit.Ground,
        Action<BoundSystem>? start = null, IReadOnlyDictionary<string, double>? elementCelsius = null)
    {
        var system = new SmallSignalSystem(circuit, AnalysisName, start);
        var layout = system.System.Layout;
        var noise = new NoiseContext(circuit.TemperatureCelsius, layout.Ground, elementCelsius);
        foreach (var s in system.System.Stamps)
            s.CollectNoise(noise);
        var generators = noise.Generators;
        var e = system.NewVector();
        e[layout.IndexOfNode(outputNode)] += 1;
        e[layout.IndexOfNode(referenceNode)] -= 1;
        e[layout.Ground] = 0;
        var y = system.NewVector();
        var f = sweep.FrequenciesHertz;
        var contributions = new double[generators.Count, f.Count];
        for (var k = 0; k < f.Count; k++)
        {
            system.Factor(f[k]);
            system.SolveTransposed(e, y);
            for (var g = 0; g < generators.Count; g++)
            {
                var gen = generators[g];
                var transfer = y[gen.Into] - y[gen.From];
                contributions[g, k] = (transfer.Real * transfer.Real + transfer.Imaginary * transfer.Imaginary) * gen.Psd(f[k]);
            }
        }
        return new NoiseResult([.. f], [.. generators.Select(g => (g.Element, g.Label))], contributions, system.Warnings);
    }
}
