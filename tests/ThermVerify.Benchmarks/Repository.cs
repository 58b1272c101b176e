using ThermVerify.Design;

namespace ThermVerify.Benchmarks;

/// <summary>The repository's bundled examples, found above the benchmark binaries.</summary>
internal static class Repository
{
    public static string Netlists { get; } = Find();

    private static string Find()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")) && Directory.Exists(Path.Combine(dir.FullName, "netlists")))
                return Path.Combine(dir.FullName, "netlists");
        throw new DirectoryNotFoundException("netlists/ not found above the benchmark binaries");
    }

    /// <summary>A bundled design by its file name ("oven-pt1000.toml").</summary>
    public static FrontEndDesign Load(string file) => DesignLoader.Load(Path.Combine(Netlists, file));

    /// <summary>Every bundled design, by name without ".toml".</summary>
    public static IEnumerable<string> Examples() =>
        Directory.GetFiles(Netlists, "*.toml").Select(Path.GetFileNameWithoutExtension).Order()!;
}
