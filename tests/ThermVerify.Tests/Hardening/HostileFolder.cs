
namespace ThermVerify.Tests.Hardening;

/// <summary>
/// A temporary folder for one hostile design: the design file, the files it names, and a canary, a path that an
/// attack would create (a shell command in a start-up file or a control section touches it). A test that the attack
/// fails asserts the canary was never created.
/// </summary>
internal sealed class HostileFolder : IDisposable
{
    private readonly DirectoryInfo root = Directory.CreateTempSubdirectory("tv-hostile-");

    public HostileFolder()
    {
        Directory.CreateDirectory(DesignFolder);
        Directory.CreateDirectory(Outside);
    }

    /// <summary>The design's own folder.</summary>
    public string DesignFolder => Path.Combine(root.FullName, "design");

    /// <summary>A folder beside it that the design must never read from.</summary>
    public string Outside => Path.Combine(root.FullName, "outside");

    /// <summary>The file an attack would create; it must never exist.</summary>
    public string Canary => Path.Combine(root.FullName, "CANARY");

    /// <summary>A shell command that creates the canary.</summary>
    public string TouchCanary => $"shell touch {Canary}";

    public string Write(string relative, string text)
    {
        var path = Path.Combine(DesignFolder, relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
        return path;
    }

    /// <summary>The small valid design with its [check] made quick to run and <paramref name="extra"/> appended.</summary>
    public static string DesignText(string extra = "") =>
        global::ThermVerify.Tests.Design.DesignText.Valid.Replace("range = \"-40 degC .. 125 degC\"", "range = \"20 degC .. 30 degC\"\nstep = \"10 K\"") + extra;

    /// <summary>That design written to <paramref name="name"/> in the design's folder; returns its path.</summary>
    public string Design(string extra = "", string name = "design.toml") => Write(name, DesignText(extra));

    public void Dispose()
    {
        try
        {
            root.Delete(recursive: true);
        }
        catch (IOException)
        {
            // a FIFO or a link left by a test; the system's temporary folder is cleaned anyway
        }
    }
}
