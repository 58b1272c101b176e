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

/// <summary>
/// Collects the noise generators of all stamps, each resistance at the circuit temperature or at its own where one is
/// given (a sensor in the process, the board's resistors at the board temperature).
/// </summary>
internal sealed class NoiseContext(double temperatureCelsius, int ground, IReadOnlyDictionary<string, double>? elementCelsius = null)
{
    /// <summary>Index of ground, for generators returning there.</summary>
    public int Ground { get; } = ground;

    public List<NoiseGenerator> Generators { get; } = [];

    public double TemperatureKelvin { get; } = PhysicalConstants.ToKelvin(temperatureCelsius);

    /// <summary>Johnson–Nyquist current noise of an element's conductance: 4kT·G in A²/Hz, T its own temperature.</summary>
    public double ThermalCurrentPsd(string element, double conductanceSiemens) =>
        4 * PhysicalConstants.BoltzmannJoulesPerKelvin * KelvinOf(element) * conductanceSiemens;

    private double KelvinOf(string element) =>
        elementCelsius is not null && elementCelsius.TryGetValue(element, out var celsius) ? PhysicalConstants.ToKelvin(celsius) : TemperatureKelvin;

    public void Add(string element, string label, int into, int from, double whitePsd, double cornerHertz)
    {
        if (whitePsd > 0)
            Generators.Add(new NoiseGenerator(element, label, into, from, whitePsd, cornerHertz));
    }
}
