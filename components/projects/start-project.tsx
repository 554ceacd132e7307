'use client';
// The first step of a project: a blank one, or one filled from a model file or workbook.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { NewProjectForm } from './new-project-form';

export function StartProject() {
  const [fromFile, setFromFile] = useState(false);
  return (
    <div className="space-y-3">
      <div className="flex gap-2" role="group" aria-label="How to start">
        <Button variant={fromFile ? 'secondary' : 'primary'} onClick={() => setFromFile(false)}>
          Blank project
        </Button>
        <Button variant={fromFile ? 'primary' : 'secondary'} onClick={() => setFromFile(true)}>
          From a file
        </Button>
      </div>
      <NewProjectForm key={String(fromFile)} withFile={fromFile} />
    </div>
  );
}
