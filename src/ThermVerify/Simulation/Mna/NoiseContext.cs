using ThermVerify.Quantities;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// One noise generator: a current of power spectral density S(f) = WhitePsd·(1 + CornerHertz/f) in A²/Hz
/// injected into unknown <see cref="Into"/> and drawn from <see cref="From"/>.
/// </summary>
internal readonly record struct NoiseGenerator(string Element, string Label, int Into, int From, double WhitePsd, double CornerHertz)
{
    public double Psd(double frequencyHertz) => WhitePsd * (1 + CornerHertz / frequencyHertz);
}

/// <summary>Collects the noise generators of all stamps at the circuit temperature.</summary>
internal sealed class NoiseContext(double temperatureCelsius, int ground)
{
    /// <summary>Index of ground, for generators returning there.</summary>
    public int Ground { get; } = ground;

    public List<NoiseGenerator> Generators { get; } = [];

    public double TemperatureKelvin { get; } = PhysicalConstants.ToKelvin(temperatureCelsius);

    /// <summary>Johnson–Nyquist current noise of a conductance: 4kT·G in A²/Hz.</summary>
    public double ThermalCurrentPsd(double conductanceSiemens) =>
        4 * PhysicalConstants.BoltzmannJoulesPerKelvin * TemperatureKelvin * conductanceSiemens;

    public void Add(string element, string label, int into, int from, double whitePsd, double cornerHertz)
    {
        if (whitePsd > 0)
            Generators.Add(new NoiseGenerator(element, label, into, from, whitePsd, cornerHertz));
    }
}
