namespace ThermVerify.Quantities;

/// <summary>
/// The kinds of quantity a design file can hold. <see cref="Quantity.Value"/> is stored in the SI unit
/// named here, with these conventions:
/// <list type="bullet">
/// <item><see cref="Celsius"/> is an absolute temperature in °C; <see cref="Kelvin"/> is a temperature
/// <em>difference</em> in K (a step, a budget, a doubling interval). An absolute temperature is never
/// written in K, so "25 K" cannot be misread as −248.15 °C.</item>
/// <item><see cref="Percent"/>, <see cref="Ppm"/> and <see cref="PpmPerKelvin"/> are stored as plain
/// fractions: 1 % → 0.01, 25 ppm → 25e-6, 25 ppm/K → 25e-6 per K.</item>
/// <item><see cref="Decibel"/> and <see cref="Lsb"/> keep the number as written (100 dB → 100).</item>
/// </list>
/// </summary>
public enum UnitKind
{
    Dimensionless,
    Ohm,
    Volt,
    Ampere,
    Farad,
    Second,
    Hertz,
    /// <summary>A temperature difference in K.</summary>
    Kelvin,
    /// <summary>An absolute temperature in °C.</summary>
    Celsius,
    Percent,
    Ppm,
    PpmPerKelvin,
    Decibel,
    WattPerKelvin,
    VoltPerSecond,
    VoltPerRootHertz,
    AmperePerRootHertz,
    Lsb,
    /// <summary>A temperature coefficient of a voltage, e.g. an op-amp's offset drift (µV/K).</summary>
    VoltPerKelvin,
    /// <summary>An angle in degrees (not radians), e.g. a phase margin.</summary>
    Degree,
    /// <summary>A rate of temperature change, e.g. a ramp the reading must follow (K/s, K/min).</summary>
    KelvinPerSecond,
    /// <summary>An electric charge in coulombs, e.g. a switch's charge injection (pC).</summary>
    Coulomb,
}
