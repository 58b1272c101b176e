using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Design;

public class SensorSpecBuildTests
{

    [Fact]
    public void BetaSpecBuildsABetaThermistorWithItsParameters()
    {
        var spec = new BetaSensorSpec { R0Ohms = 10e3, BetaKelvin = 3435, ReferenceCelsius = 25 };
        var model = Assert.IsType<BetaThermistor>(spec.Build());
        Assert.Equal(10e3, model.R0Ohms);
        Assert.Equal(3435, model.Beta);
        // Beta model at T0 gives R0 by definition.
        Tolerance.AssertClose(10e3, model.ResistanceOhms(25), 1e-12);
    }

    [Fact]
    public void RtdSpecBuildsAnIecRtd()
    {
        var model = new RtdSensorSpec { R0Ohms = 100 }.Build();
        // IEC 60751 Pt100 table: 100 °C → 138.51 Ω (two decimals as printed).
        Tolerance.AssertClose(138.51, model.ResistanceOhms(100), 0, 0.005);
    }

    [Fact]
    public void SteinhartHartSpecPassesItsCoefficients()
    {
        var model = Assert.IsType<SteinhartHartThermistor>(new SteinhartHartSensorSpec { A = 1e-3, B = 2e-4, C = 1e-7 }.Build());
        Assert.Equal(1e-3, model.A);
        Assert.Equal(2e-4, model.B);
        Assert.Equal(1e-7, model.C);
        Assert.Equal(0, model.D);
    }
}
