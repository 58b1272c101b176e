using ThermVerify.FrontEnd;
using ThermVerify.Sensors;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>How a unit's parts move: the RTD class band, the converter's static errors, the unit streams.</summary>
public class PartModelTests
{
    /// <summary>
    /// A Pt100 at the top of IEC 60751 class B, ±(0.3 + 0.005·|t|) K, has at 100 °C the resistance the standard's
    /// curve gives at 100.8 °C: R0·(1 + A·t + B·t² + C·(t − 100)·t³) with A = 3.9083e-3, B = −5.775e-7, C = −4.183e-12 below 0 °C and 0 above (IEC 60751), and the
    /// shifted model's inverse returns the true temperature.
    /// </summary>
    [Fact]
    public void RtdAtTheEdgeOfItsClassReadsTheBandHigh()
    {
        var unit = new ShiftedSensor(new PlatinumRtd(100), RtdToleranceClass.B, 1);
        static double Cvd(double t) => 100 * (1 + 3.9083e-3 * t - 5.775e-7 * t * t + (t < 0 ? -4.183e-12 * (t - 100) * t * t * t : 0));
        Tolerance.AssertClose(Cvd(100.8), unit.ResistanceOhms(100), 1e-12);
        Tolerance.AssertClose(100, unit.TemperatureCelsius(Cvd(100.8)), 0, 1e-9);
        Tolerance.AssertClose(Cvd(-0.3 - 0.005 * 0), new ShiftedSensor(new PlatinumRtd(100), RtdToleranceClass.B, -1).ResistanceOhms(0), 1e-12);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(-1)]
    public void A_shifted_RTDs_valid_range_ends_where_the_shifted_curve_reaches_the_standards_ends(double fraction)
    {
        // Class B at f: t + f·(0.3 + 0.005·|t|) is the nominal curve's −200 °C and 850 °C (IEC 60751's range) at the
        // unit's range ends, t = (850 − 0.3f)/(1 + 0.005f) and (−200 − 0.3f)/(1 − 0.005f) (solved by hand); a model built
        // on the unit may read its ends without leaving the nominal curve's range.
        var unit = new ShiftedSensor(new PlatinumRtd(100), RtdToleranceClass.B, fraction);
        Tolerance.AssertClose((850 - 0.3 * fraction) / (1 + 0.005 * fraction), unit.ValidRange.MaxCelsius, 1e-12);
        Tolerance.AssertClose((-200 - 0.3 * fraction) / (1 - 0.005 * fraction), unit.ValidRange.MinCelsius, 1e-12);
        var nominal = new PlatinumRtd(100);
        Tolerance.AssertClose(nominal.ResistanceOhms(850), unit.ResistanceOhms(unit.ValidRange.MaxCelsius), 1e-12);
        Tolerance.AssertClose(nominal.ResistanceOhms(-200), unit.ResistanceOhms(unit.ValidRange.MinCelsius), 1e-12);
    }

    /// <summary>
    /// IEEE Std 1241 static errors: transitions scaled by (1 + gain error) and shifted by the offset; the INL bow is
    /// zero at both ends of the scale and equal to the INL at mid-scale (end-point definition).
    /// </summary>
    [Fact]
    public void ConverterErrorsFollowTheirDefinitions()
    {
        var offsetAndGain = new ConverterErrors(OffsetLsb: 2, GainError: 0.001, InlBowLsb: 0);
        Tolerance.AssertClose(1000 * 1.001 + 2, offsetAndGain.Code(1000, 12), 1e-15);
        var inl = new ConverterErrors(0, 0, 1.5);
        Tolerance.AssertClose(0, inl.Code(0, 12), 0, 1e-12);
        Tolerance.AssertClose(4096, inl.Code(4096, 12), 1e-15);
        Tolerance.AssertClose(2048 + 1.5, inl.Code(2048, 12), 1e-15);
    }

    /// <summary>A unit's stream depends on (seed, index) only; uniform draws cover [0, 1) with mean ½ and variance 1/12.</summary>
    [Fact]
    public void UnitStreamsAreReproducibleAndUniform()
    {
        var a = new UnitRandom(5, 17);
        var b = new UnitRandom(5, 17);
        var c = new UnitRandom(5, 18);
        Assert.Equal(a.NextUInt64(), b.NextUInt64());
        Assert.NotEqual(new UnitRandom(5, 17).NextUInt64(), c.NextUInt64());
        const int n = 100_000;
        var values = new double[n];
        var r = new UnitRandom(1, 0);
        for (var i = 0; i < n; i++) values[i] = r.NextUnit();
        var mean = values.Average();
        var variance = values.Sum(v => (v - mean) * (v - mean)) / (n - 1);
        // Standard errors: √(1/12/N) for the mean, √((1/80 − 1/144)/N) for the variance of a uniform (moments of the uniform law).
        Tolerance.AssertClose(0.5, mean, 0, 4 * Math.Sqrt(1.0 / 12 / n));
        Tolerance.AssertClose(1.0 / 12, variance, 0, 4 * Math.Sqrt((1.0 / 80 - 1.0 / 144) / n));
        Assert.All(values, v => Assert.InRange(v, 0, 1 - 1e-17));
    }
}
