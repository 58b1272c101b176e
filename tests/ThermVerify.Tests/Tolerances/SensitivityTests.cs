using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>Sensitivities of the divider and of the reading, against finite differences and the closed form.</summary>
public class SensitivityTests
{
    /// <summary>
    /// Partial derivatives of V = E·R_s/(R_s + R_f) (low side) and V = E·R_f/(R_s + R_f) (high side), written out by
    /// hand, against central finite differences of the divider formula (elementary calculus; the difference
    /// quotient with h = 10⁻⁴ relative has a truncation error of order h², far below the 10⁻⁶ tolerance).
    /// </summary>
    [Theory]
    [InlineData(SensorSide.Low, 3.3, 10e3, 10e3)]
    [InlineData(SensorSide.Low, 5.0, 2.2e3, 47e3)]
    [InlineData(SensorSide.High, 3.3, 100e3, 33e3)]
    public void DividerPartialsMatchFiniteDifferences(SensorSide side, double e, double rs, double rf)
    {
        double V(double ee, double s, double f) => DividerFormula.OutputVolts(side, ee, s, f);
        double Central(Func<double, double> g, double x) { var h = 1e-4 * x; return (g(x + h) - g(x - h)) / (2 * h); }
        var sum = rs + rf;
        var dVdRs = side == SensorSide.Low ? e * rf / (sum * sum) : -e * rf / (sum * sum);
        var dVdRf = side == SensorSide.Low ? -e * rs / (sum * sum) : e * rs / (sum * sum);
        var dVdE = V(e, rs, rf) / e;
        Tolerance.AssertClose(Central(s => V(e, s, rf), rs), dVdRs, 1e-6, what: "dV/dR_sensor");
        Tolerance.AssertClose(Central(f => V(e, rs, f), rf), dVdRf, 1e-6, what: "dV/dR_fixed");
        Tolerance.AssertClose(Central(x => V(x, rs, rf), e), dVdE, 1e-6, what: "dV/dE");
        Tolerance.AssertClose(dVdRs, DividerFormula.SlopeVoltsPerOhm(side, e, rs, rf), 1e-12, what: "library slope");
    }

    /// <summary>
    /// The analysis's sensitivities (central differences through the simulated DC sweep and the firmware's reading)
    /// against the closed form: a ratiometric divider reads R_s/R_f, so a fraction δ on R_s reads as the temperature
    /// where R is δ·R_s higher, ΔT = δ·R_s/(dR_s/dT), and δ on R_f as the opposite, −δ·R_s/(dR_s/dT); the excitation
    /// cancels (ratiometric). Elementary calculus on the divider and the β model (IEC 60539-1 terms).
    /// </summary>
    [Fact]
    public void ReadingSensitivitiesMatchTheRatiometricClosedForm()
    {
        var design = ToleranceTestDesigns.TwoResistors();
        design = design with { Divider = design.VoltageDivider with { ExcitationTolerance = 0.01 } };
        var result = WorstCase.Run(design, new WorstCaseOptions { Threads = 1 });
        var sensor = design.Sensor.Build();
        var byKind = result.Sensitivities.ToDictionary(s => s.Parameter.Kind);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            var expected = sensor.ResistanceOhms(t) / sensor.SlopeOhmsPerKelvin(t);
            // Central differences over ±1 % carry a second-order term of about 1e-4 relative.
            Tolerance.AssertClose(expected, byKind[ToleranceKind.SensorResistance].KelvinPerUnit[k], 2e-3, what: $"sensor at {t} °C");
            Tolerance.AssertClose(-expected, byKind[ToleranceKind.FixedResistance].KelvinPerUnit[k], 2e-3, what: $"fixed at {t} °C");
            Tolerance.AssertClose(0, byKind[ToleranceKind.Excitation].KelvinPerUnit[k], 0, 1e-9, what: $"excitation at {t} °C");
        }
    }

    /// <summary>
    /// Root sum of squares of independent uniform tolerances: σ = a/√3 for each (the uniform distribution's
    /// standard deviation, any statistics handbook), so σ_T = √((s_R·a_R)² + (s_F·a_F)²)/√3.
    /// </summary>
    [Fact]
    public void RssOfUniformTolerancesMatchesTheClosedForm()
    {
        var design = ToleranceTestDesigns.TwoResistors();
        var result = WorstCase.Run(design, new WorstCaseOptions { Threads = 1 });
        var sensor = design.Sensor.Build();
        foreach (var p in result.Points)
        {
            var s = sensor.ResistanceOhms(p.Celsius) / sensor.SlopeOhmsPerKelvin(p.Celsius);
            var expectedSigma = Math.Sqrt(Math.Pow(s * 0.01, 2) + Math.Pow(s * 0.001, 2)) / Math.Sqrt(3);
            Tolerance.AssertClose(expectedSigma, p.SigmaKelvin, 2e-3, what: $"σ at {p.Celsius} °C");
            Tolerance.AssertClose(expectedSigma * Math.Sqrt(3), p.RssKelvin, 2e-3, what: $"RSS at {p.Celsius} °C");
            Tolerance.AssertClose(Math.Abs(s) * 0.011, p.LinearSumKelvin, 2e-3, what: $"linear sum at {p.Celsius} °C");
        }
    }

    /// <summary>σ of a uniform ±a is a/√3; of a normal with a at kσ, a/k (definitions).</summary>
    [Fact]
    public void DistributionStandardDeviations()
    {
        Tolerance.AssertClose(0.01 / Math.Sqrt(3), ToleranceDistribution.Uniform.StandardDeviation(0.01), 1e-15);
        Tolerance.AssertClose(0.01 / 3, ToleranceDistribution.Normal(3).StandardDeviation(0.01), 1e-15);
    }

    /// <summary>
    /// Extreme-value analysis picks, at each temperature, the corner the signs of the sensitivities give; for a
    /// ratio R_s/R_f that is R_s high with R_f low or the reverse (monotone in each part), and the enumeration of all
    /// corners confirms it (common practice, no source).
    /// </summary>
    [Fact]
    public void SensitivityCornersAreTheEnumeratedExtremes()
    {
        var result = WorstCase.Run(ToleranceTestDesigns.TwoResistors(), new WorstCaseOptions { Threads = 1 });
        var enumeration = Assert.IsType<CornerEnumeration>(result.Enumeration);
        Assert.Equal(4, enumeration.Corners);
        Assert.True(enumeration.LargestShortfallKelvin <= 1e-9, $"shortfall {enumeration.LargestShortfallKelvin} K");
        foreach (var p in result.Points)
        {
            // Both corners move the reading by about ±Σ|s·a| around the nominal (the ½ LSB of a 16-bit reading aside).
            Tolerance.AssertClose(p.NominalKelvin + p.LinearSumKelvin, p.HighKelvin, 0.02, 0.01, what: $"high at {p.Celsius} °C");
            Tolerance.AssertClose(p.NominalKelvin - p.LinearSumKelvin, p.LowKelvin, 0.02, 0.01, what: $"low at {p.Celsius} °C");
        }
    }
}
