using System.Xml.Linq;

namespace MpptArena.Reports.Exporters;

/// <summary>Writes JUnit XML (the common testsuites/testsuite/testcase form CI systems read).</summary>
public static class JUnitWriter
{
    /// <summary>The XML document for the cases, one testsuite per suite name.</summary>
    public static XDocument Build(IEnumerable<JUnitCase> cases)
    {
        var suites = cases.GroupBy(c => c.Suite).Select(g => new XElement("testsuite",
            new XAttribute("name", g.Key),
            new XAttribute("tests", g.Count()),
            new XAttribute("failures", g.Count(c => c.Failure is not null)),
            new XAttribute("errors", 0),
            g.Select(c => new XElement("testcase",
                new XAttribute("classname", g.Key),
                new XAttribute("name", c.Name),
                c.Failure is null ? null : new XElement("failure", new XAttribute("message", c.Failure), c.Failure),
                new XElement("system-out", c.Output)))));
        var list = suites.ToList();
        return new XDocument(new XElement("testsuites",
            new XAttribute("tests", list.Sum(s => (int)s.Attribute("tests")!)),
            new XAttribute("failures", list.Sum(s => (int)s.Attribute("failures")!)),
            list));
    }

    /// <summary>Writes the cases to <paramref name="path"/>.</summary>
    public static void Write(string path, IEnumerable<JUnitCase> cases)
    {
        string? dir = Path.GetDirectoryName(Path.GetFullPath(path));
        if (dir is not null) Directory.CreateDirectory(dir);
        Build(cases).Save(path);
    }
}
