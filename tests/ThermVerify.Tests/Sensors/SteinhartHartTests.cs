using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class SteinhartHartTests
{
    [Fact]
    public void Temperature_is_the_reciprocal_of_the_polynomial_in_ln_R()
    {
        // Steinhart & Hart (1968): 1/T = A + B ln R + C (ln R)³, evaluated directly.
        var x = Math.Log(12_345);
        var expected = 1 / (1.1e-3 + 2.4e-4 * x + 1.0e-7 * x * x * x) - 273.15;
        Tolerance.AssertClose(expected, TestSensors.SteinhartHart().TemperatureCelsius(12_345), rel: 0, abs: 1e-10);
    }

    [Theory]
    [InlineData(-55)]
    [InlineData(0)]
    [InlineData(25)]
    [InlineData(155)]
    public void Closed_form_cubic_inverse_satisfies_the_equation(double celsius)
    {
        // Encyclopedia article "Steinhart–Hart equation": the inverse by the cubic must satisfy the forward equation.
        var sh = TestSensors.SteinhartHart();
        var x = Math.Log(sh.ResistanceOhms(celsius));
        Tolerance.AssertClose(1 / (celsius + 273.15), 1.1e-3 + 2.4e-4 * x + 1.0e-7 * x * x * x, rel: 1e-13);
    }

    [Fact]
    public void Four_term_inverse_satisfies_the_equation()
    {
        // 1/T = A + B x + C x³ + D x², x = ln R (the squared-term extension), evaluated directly.
        var sh = TestSensors.SteinhartHartFourTerm();
        var x = Math.Log(sh.ResistanceOhms(60));
        Tolerance.AssertClose(1 / 333.15, 1.1e-3 + 2.3e-4 * x + 1.0e-7 * x * x * x + 1.5e-6 * x * x, rel: 1e-13);
    }

    [Fact]
    public void Coefficients_that_do_not_fall_monotonically_are_refused()
    {
        // B < 0 makes R rise with T: not an NTC.
        var e = Assert.Throws<ArgumentException>(() => new SteinhartHartThermistor(5e-3, -2.4e-4, 1e-7));
        Assert.Contains("falls strictly", e.Message);
    }

    [Fact]
    public void Out_of_range_names_the_resistance_span()
    {
        var sh = TestSensors.SteinhartHart();
        var e = Assert.Throws<SensorRangeException>(() => sh.TemperatureCelsius(1));
        Assert.Contains("Steinhart–Hart", e.Message);
        Assert.Contains("-55 °C to 155 °C", e.Message);
    }
}
