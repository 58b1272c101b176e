using ThermVerify.Design;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// Every design in netlists/, found by listing the folder, so a new example is cross-checked without a test edit.
/// <see cref="All"/> holds the successive-approximation designs, which every sampling analysis runs on; the delta-sigma
/// designs, which those analyses refuse, are <see cref="DeltaSigma"/> and have tests of their own.
/// </summary>
public static class ExampleDesigns
{
    public static string Folder()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "netlists");
            if (Directory.Exists(candidate) && File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")))
                return candidate;
        }
        throw new DirectoryNotFoundException("netlists/ not found above the test binaries");
    }

    public static TheoryData<string> All() => Of(ConverterKind.SuccessiveApproximation);

    public static TheoryData<string> DeltaSigma() => Of(ConverterKind.DeltaSigma);

    private static TheoryData<string> Of(ConverterKind kind)
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(Folder(), "*.toml").Order(StringComparer.Ordinal))
            if (DesignLoader.Load(file).Adc.Kind == kind)
                data.Add(Path.GetFileName(file));
        return data;
    }

    /// <summary>
    /// The agreement to allow between the engines where a netlist has diodes, in LSB: their leakage follows
    /// exp(EG/(n·Vt)·(T/T0 − 1)), and ngspice's k/q (an older value than CODATA's, from memory) moves that exponent by
    /// about 3e-5 relative, 1.5e-4 of the leakage (NetlistNgspiceTests). Null for every other design.
    /// </summary>
    public static double? DiodeLawSlackLsb(FrontEndDesign design) =>
        design.Netlist?.Parsed.Elements.Any(e => e.Kind == 'D') == true ? 0.05 : null;

    public static FrontEndDesign Load(string fileName) => DesignLoader.Load(Path.Combine(Folder(), fileName));
}
