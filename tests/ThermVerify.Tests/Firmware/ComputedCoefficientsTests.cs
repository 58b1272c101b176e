using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Firmware;

public class ComputedCoefficientsTests
{
    [Fact]
    public void A_beta_sensor_gives_back_its_beta_and_a_Steinhart_Hart_curve_with_C_zero()
    {
        // Steinhart & Hart (1968) / encyclopedia article "Steinhart–Hart equation": the Beta model is the SH form with
        // C = 0, B = 1/β, A = 1/T0 − ln(R0)/β, so both fits are exact for a Beta sensor.
        var c = ComputedCoefficients.Fit(FirmwareTestModels.NtcLowSide());
        Tolerance.AssertClose(3435, c.Beta.Beta, rel: 1e-9, what: "β");
        Tolerance.AssertClose(1 / 3435.0, c.LeastSquares.B, rel: 1e-8, what: "SH B");
        Tolerance.AssertClose(1 / 298.15 - Math.Log(10_000) / 3435, c.ThreePoint.A, rel: 1e-8, what: "SH A");
        Assert.True(Math.Abs(c.ThreePoint.C) < 1e-13);
        Assert.True(c.BetaMaxErrorKelvin < 1e-9 && c.LeastSquaresMaxErrorKelvin < 1e-6 && c.ThreePointMaxErrorKelvin < 1e-6);
    }

    [Fact]
    public void A_Steinhart_Hart_sensor_is_fitted_exactly_by_SH_and_only_approximately_by_beta()
    {
        var sh = new SteinhartHartThermistor(1.1e-3, 2.4e-4, 1.0e-7);
        var model = new FirmwareModel(sh, SensorSide.Low, 10_000, 3.3, new AdcTransfer(12, 3.3), new TemperatureRange(-20, 100));
        var c = ComputedCoefficients.Fit(model);
        Assert.True(c.ThreePointMaxErrorKelvin < 1e-6, $"{c.ThreePointMaxErrorKelvin} K");
        Assert.True(c.LeastSquaresMaxErrorKelvin < 1e-6, $"{c.LeastSquaresMaxErrorKelvin} K");
        // β through 25 °C and 100 °C is exact at those two points only; elsewhere the C term shows.
        Assert.True(c.BetaMaxErrorKelvin > 0.01, $"{c.BetaMaxErrorKelvin} K");
        Tolerance.AssertClose(100, ComputedCoefficients.BetaCelsius(c.Beta, sh.ResistanceOhms(100)), rel: 0, abs: 1e-9);
    }

    [Fact]
    public void A_platinum_RTD_has_no_NTC_forms()
    {
        var e = Assert.Throws<FirmwareInputException>(() => ComputedCoefficients.Fit(FirmwareTestModels.Pt1000HighSide()));
        Assert.Contains("lookup table", e.Message);
    }
}
