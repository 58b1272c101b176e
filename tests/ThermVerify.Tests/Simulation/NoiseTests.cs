using ThermVerify.Simulation;
using ThermVerify.Circuits;
using ThermVerify.Quantities;

namespace ThermVerify.Tests.Simulation;

public class NoiseTests
{
    private const double K = PhysicalConstants.BoltzmannJoulesPerKelvin;

    [Theory]
    [InlineData(25.0)]
    [InlineData(85.0)]
    public void Resistor_noise_density_is_johnson_nyquist(double celsius)
    {
        const double r1 = 10e3, r2 = 30e3;
        var req = r1 * r2 / (r1 + r2);
        var circuit = new CircuitBuilder()
            .Resistor("R1", "x", "0", r1)
            .Resistor("R2", "x", "0", r2)
            .At(celsius)
            .Build();
        var noise = NoiseAnalysis.Run(circuit, "x", FrequencySweep.Logarithmic(1, 1e6, 2));
        var t = PhysicalConstants.ToKelvin(celsius);
        foreach (var density in noise.OutputDensity)
            // Johnson–Nyquist: e_n = √(4kTR), k exact (SI Brochure, 9th ed.), R = R1 ∥ R2.
            Tolerance.AssertClose(Math.Sqrt(4 * K * t * req), density, 1e-12);
        // Each resistor's share: its current noise 4kT/Ri through R1 ∥ R2.
        Tolerance.AssertClose(4 * K * t / r1 * req * req, noise.ContributionPsd("R1")[0], 1e-12);
    }

    [Theory]
    [InlineData(100.0)]
    [InlineData(10e3)]
    [InlineData(1e6)]
    public void Rc_low_pass_total_noise_is_kt_over_c_whatever_r(double ohms)
    {
        const double c = 1e-9;
        var fc = 1 / (2 * Math.PI * ohms * c);
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 0)
            .Resistor("R1", "in", "out", ohms)
            .Capacitor("C1", "out", "0", c)
            .Build();
        var noise = NoiseAnalysis.Run(circuit, "out", FrequencySweep.Logarithmic(fc * 1e-6, fc * 1e6, 100));
        // kT/C noise: ∫ 4kTR/(1 + (f/fc)²) df over 0…∞ = kT/C (textbook). The sweep omits fc·1e-6 below and
        // 1e-6 of the tail above (together ~1.3e-6 of the power); power-law quadrature at 100 points per decade
        // leaves about 2e-5 of the power near the corner.
        Tolerance.AssertClose(Math.Sqrt(K * 298.15 / c), noise.RmsVolts(), 3e-5);
    }

    [Fact]
    public void Op_amp_voltage_noise_with_flicker_corner_appears_at_a_follower_output()
    {
        const double en = 10e-9, corner = 100;
        var amp = new OpAmp("U1", "in", "out", "out") { OpenLoopGain = 1e6, GainBandwidthHertz = 10e6, VoltageNoiseVoltsPerRootHertz = en, VoltageNoiseCornerHertz = corner };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vin", "in", "0", 1)
            .Add(amp)
            .Resistor("Rload", "out", "0", 10e3)
            .Build();
        var noise = NoiseAnalysis.Run(circuit, "out", FrequencySweep.At(1, 100, 1e3));
        var psd = noise.ContributionPsd("U1");
        // e_n²(f) = e_w²·(1 + f_c/f) (white plus 1/f corner, common practice, no source), with gain 1 in a
        // follower far below GBW (the 10 kΩ load against the 50 Ω output leaves 5e-3 relative).
        for (var k = 0; k < 3; k++)
        {
            var f = noise.FrequenciesHertz[k];
            Tolerance.AssertClose(en * en * (1 + corner / f) * Math.Pow(10e3 / (10e3 + 50e-6), 2), psd[k], 1e-3);
        }
    }
}
