using ThermVerify.Check.Buffer;
using ThermVerify.Circuits;

namespace ThermVerify.Tests.Check.Buffer;

public class BufferNoiseTests
{
    // Boltzmann constant, exact (SI Brochure, 9th ed.), written here rather than taken from the library.
    private const double K = 1.380649e-23;

    [Theory]
    [InlineData(-20)]
    [InlineData(25)]
    [InlineData(80)]
    public void Resistors_and_sampling_capacitor_match_johnson_nyquist_and_kt_over_c(double celsius)
    {
        // Noiseless op-amp; filter 10 kΩ into 100 nF; 1 pF sampling capacitor behind 100 Ω.
        var design = BufferDesigns.Follower(("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        var point = Assert.Single(BufferNoise.Run(design, [celsius]).Points);
        var t = celsius + 273.15;
        double Part(string element) => point.Contributions.Where(c => c.Element == element).Sum(c => c.RmsVolts * c.RmsVolts);

        // kT/C: the switch resistor's noise on the sampling capacitor, in series with the reservoir through the pin.
        var cSeries = 1e-12 * 100e-9 / (1e-12 + 100e-9);
        Tolerance.AssertClose(Math.Sqrt(K * t / cSeries), Math.Sqrt(Part(BufferCircuits.SwitchResistor)), 0.005, 0, "kT/C of the sampling capacitor");
        Tolerance.AssertClose(Math.Sqrt(K * t / 1e-12), point.KtcVolts, 1e-12);
        // kT/C again: the filter resistor's noise on the reservoir (plus the sampling capacitor beside it).
        Tolerance.AssertClose(Math.Sqrt(K * t / (100e-9 + 1e-12)), Math.Sqrt(Part("Rfilter")), 0.005, 0, "kT/C of the reservoir");
        // Johnson–Nyquist 4kTR of the sensor, divided by R_fixed/(R_s + R_fixed), through the unity follower and the
        // single-pole filter, whose noise bandwidth is 1/(4·R_f·C).
        var rs = 10e3 * Math.Exp(3435 * (1 / t - 1 / 298.15));
        var divided = 4 * K * t * rs * Math.Pow(10e3 / (rs + 10e3), 2);
        Tolerance.AssertClose(Math.Sqrt(divided / (4 * 10e3 * 100e-9)), Math.Sqrt(Part("Rsensor")), 0.005, 0, "sensor Johnson noise through the filter");
    }

    [Fact]
    public void Averaging_factor_is_one_over_n_for_white_noise_and_one_when_fully_correlated()
    {
        // Variance of the mean of N samples with lag-k correlation ρ^k (elementary statistics, from memory).
        Tolerance.AssertClose(1.0 / 16, BufferNoise.CorrelatedFactor(16, 0), 1e-15);
        Tolerance.AssertClose(1.0, BufferNoise.CorrelatedFactor(16, 1), 1e-12);
        // N = 2: (1 + ρ)/2.
        Tolerance.AssertClose((1 + 0.3) / 2, BufferNoise.CorrelatedFactor(2, 0.3), 1e-15);
    }
}
