using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Packaging;

/// <summary>
/// The README's install steps, run as a user would: pack the command-line project as a .NET tool, install the package
/// into a private tool folder, run the installed command on a bundled example. It must print what the CLI prints
/// in-process. Everything goes to a temporary folder (its own build output too), so the repository is left as it was.
/// </summary>
public sealed class ToolPackageTests
{
    [Fact]
    public void The_packed_tool_installs_and_checks_a_bundled_example()
    {
        var work = Directory.CreateTempSubdirectory("tv-tool-");
        try
        {
            var packages = Path.Combine(work.FullName, "packages");
            var tools = Path.Combine(work.FullName, "tools");
            ExternalProgram.Run("dotnet", ["pack", Repository.PathOf("src", "ThermVerify.Cli"), "-c", "Release", "-o", packages,
                "--artifacts-path", Path.Combine(work.FullName, "build")], work.FullName);
            Assert.Single(Directory.GetFiles(packages, "ThermVerify.Cli.*.nupkg"));
            ExternalProgram.Run("dotnet", ["tool", "install", "--tool-path", tools, "--add-source", packages, "ThermVerify.Cli"], work.FullName);

            var example = Path.Combine(Repository.Netlists, "oven-pt1000.toml");
            var installed = ExternalProgram.Run(Path.Combine(tools, "thermverify"), ["check", example, "-q"], work.FullName);
            Assert.StartsWith("PASS", installed);
            Assert.Equal(CliRunner.Run("check", example, "-q").Output, installed);
        }
        finally
        {
            work.Delete(recursive: true);
        }
    }
}
