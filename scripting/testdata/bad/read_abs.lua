local rows = read_csv("/etc/passwd")
