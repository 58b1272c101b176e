using System.Diagnostics;

namespace ThermVerify.Tests;

/// <summary>Runs an outside program (dotnet, gcc, a compiled test program, ngspice) to its end; a non-zero exit fails the test with what it printed.</summary>
internal static class ExternalProgram
{
    public static string Run(string file, IEnumerable<string> arguments, string workingDirectory)
    {
        var info = new ProcessStartInfo(file)
        {
            WorkingDirectory = workingDirectory, RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true,
        };
        foreach (var argument in arguments) info.ArgumentList.Add(argument);
        using var process = Process.Start(info)!;
        process.StandardInput.Close();
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        Assert.True(process.ExitCode == 0, $"{file} {string.Join(' ', info.ArgumentList)} failed with {process.ExitCode}:\n{output}\n{error.Result}");
        return output;
    }
}
