namespace ThermVerify.Quantities;

/// <summary>Exact constants of the SI (SI Brochure, 9th edition, 2019).</summary>
internal static class PhysicalConstants
{
    /// <summary>Offset between the Celsius and Kelvin scales: T/K = t/°C + 273.15.</summary>
    public const double ZeroCelsiusInKelvin = 273.15;

    /// <summary>Boltzmann constant k in J/K, exact since the 2019 redefinition.</summary>
    public const double BoltzmannJoulesPerKelvin = 1.380649e-23;

    /// <summary>Elementary charge q in C, exact since the 2019 redefinition.</summary>
    public const double ElementaryChargeCoulombs = 1.602176634e-19;

    public static double ToKelvin(double celsius) => celsius + ZeroCelsiusInKelvin;

    public static double ToCelsius(double kelvin) => kelvin - ZeroCelsiusInKelvin;

    /// <summary>The thermal voltage V_t = kT/q at <paramref name="celsius"/>.</summary>
    public static double ThermalVolts(double celsius) => BoltzmannJoulesPerKelvin * ToKelvin(celsius) / ElementaryChargeCoulombs;
}
