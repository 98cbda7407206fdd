namespace LongRecord.Pipeline.Tests;

/// <summary>Finds the scenario catalogue (fixtures/scenarios) above the test assembly.</summary>
public static class Scenarios
{
    public static string Path(string name)
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var p = System.IO.Path.Combine(d.FullName, "fixtures", "scenarios", name + ".json");
            if (File.Exists(p))
            {
                return p;
            }
        }

        throw new FileNotFoundException($"fixtures/scenarios/{name}.json not found above {AppContext.BaseDirectory}");
    }
}
