namespace ThermVerify.Tests;

/// <summary>Where the repository's own files are, found from the test assembly's folder upwards.</summary>
internal static class Repository
{
    public static string Root { get; } = Find();

    public static string Netlists => Path.Combine(Root, "netlists");

    public static string Docs => Path.Combine(Root, "docs");

    public static string PathOf(params string[] parts) => Path.Combine([Root, .. parts]);

    private static string Find()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "thermverify.sln")))
                return dir.FullName;
        throw new InvalidOperationException("The tests run outside the repository: no thermverify.sln above " + AppContext.BaseDirectory);
    }
}
